import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decliningBalanceFast, loanYearsFast, roundCentsFast, straightLineFast } from '../../../shared/engine/cents';
import { decliningBalance, straightLine } from '../../../shared/engine/depreciation';
import { irr, loanSchedule } from '../../../shared/engine/finance';
import { irrFast } from '../../../shared/engine/irr-fast';
import { toCents } from '../../../shared/engine/money';

// The fast path's floating-point twins must give the decimal.js ledger's cents.
describe('floating-point twins of the ledger functions', () => {
  it('round to cents half-up like decimal.js, ties away from zero', () => {
    // 1.005 → 1.01 and −1.005 → −1.01 (money.ts convention; binary 1.005 is 1.00499…).
    expect(roundCentsFast(1.005)).toBe(1.01);
    expect(roundCentsFast(-1.005)).toBe(-1.01);
    expect(roundCentsFast(2.675)).toBe(toCents(2.675));
    fc.assert(
      fc.property(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 0, max: 999 }), (whole, thousandths) => {
        const amount = whole + Math.sign(whole || 1) * (thousandths / 1000);
        expect(roundCentsFast(amount) === toCents(amount)).toBe(true);
      }),
      { numRuns: 2000 },
    );
    // A computed value one ulp below a tie reads as below it in its shortest form, so decimal.js rounds down.
    expect(roundCentsFast(570.3749999999999)).toBe(toCents(570.3749999999999));
    expect(roundCentsFast(570.3749999999999)).toBe(570.37);
    fc.assert(
      fc.property(fc.double({ min: -1e10, max: 1e10, noNaN: true }), (amount) => {
        // === so that −0 and +0 count as the same cents.
        expect(roundCentsFast(amount) === toCents(amount)).toBe(true);
      }),
      { numRuns: 5000 },
    );
  });

  it('give the straight-line and declining-balance ledger schedules', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e7, noNaN: true }), fc.integer({ min: 1, max: 60 }), fc.constantFrom(1.5, 2, 2.5), (cost, life, factor) => {
        expect(straightLineFast(cost, life)).toEqual(straightLine(cost, life));
        expect(decliningBalanceFast(cost, life, factor)).toEqual(decliningBalance(cost, life, factor));
      }),
      { numRuns: 300 },
    );
  });

  it('give the loan schedule year by year', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 500_000_000 }),
        fc.integer({ min: 0, max: 300 }),
        fc.integer({ min: 1, max: 40 }),
        fc.constantFrom(1 as const, 2 as const, 4 as const, 12 as const),
        fc.integer({ min: 0, max: 60 }),
        (principalCents, rateBp, years, paymentsPerYear, interestOnlyMonths) => {
          fc.pre(Math.ceil((interestOnlyMonths * paymentsPerYear) / 12) < years * paymentsPerYear);
          const principal = principalCents / 100;
          const annualRate = rateBp / 1000;
          const ledger = loanSchedule({ principal, annualRate, years, paymentsPerYear, interestOnlyMonths });
          const fast = loanYearsFast(principal, annualRate, years, paymentsPerYear, interestOnlyMonths);
          if (principalCents === 0) return;
          expect(fast.interest).toEqual(ledger.years.map((y) => y.interest));
          expect(fast.principal).toEqual(ledger.years.map((y) => y.principal));
          expect(fast.closingBalance).toEqual(ledger.years.map((y) => y.closingBalance));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('reproduce the published level payments', () => {
    // numpy pmt documentation (read): 200 000 at 7.5 %/12 for 180 months → 1854.02 a month;
    // first month's interest 200 000 × 0.00625 = 1250.00, so principal 604.02.
    const monthly = loanYearsFast(200_000, 0.075, 15, 12, 0);
    expect(monthly.interest.length).toBe(15);
    const ledger = loanSchedule({ principal: 200_000, annualRate: 0.075, years: 15, paymentsPerYear: 12 });
    expect(ledger.payments[0]?.payment).toBe(1854.02);
    expect(monthly.interest[0]).toBe(ledger.years[0]?.interest);
    // Textbook annuity (REFERENCES.md, figures recompute exactly): 5000 at 9 % for 5 years → 1285.46, year-1 interest 450.00.
    const annual = loanYearsFast(5000, 0.09, 5, 1, 0);
    expect(annual.interest[0]).toBe(450);
    expect(annual.principal[0]).toBeCloseTo(1285.46 - 450, 9);
    expect(annual.principal.reduce((a, b) => a + b, 0)).toBeCloseTo(5000, 9);
  });

  it('find the same IRR as finance.ts', () => {
    // Gitman, Principles of Managerial Finance (as quoted in numpy-financial irr docs, read): −100, 39, 59, 55, 20 → 0.28095.
    const gitman = irrFast([-100, 39, 59, 55, 20]);
    expect(gitman.value).toBeCloseTo(0.28095, 5);
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.array(fc.double({ min: 0, max: 3e5, noNaN: true }), { minLength: 1, maxLength: 40 }),
        (outlay, inflows) => {
          const flows = [-outlay, ...inflows];
          const reference = irr(flows);
          const fast = irrFast(flows);
          if (reference.value === null) expect(fast).toEqual(reference);
          else expect(fast.value).toBeCloseTo(reference.value, 9);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('defer to finance.ts when the flows change sign more than once', () => {
    // −100, 230, −132 has roots 10 % and 20 % (textbook multiple-IRR example, recomputes exactly).
    expect(irrFast([-100, 230, -132])).toEqual(irr([-100, 230, -132]));
    expect(irrFast([-100, 230, -132]).value).toBeNull();
  });
});
