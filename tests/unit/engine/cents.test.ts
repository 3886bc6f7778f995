import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decliningBalanceFast, loanScheduleFast, loanYearsFast, loanYearsSideBySide, roundCentsFast, straightLineFast } from '../../../shared/engine/cents';
import { noiseFreeCents } from '../../../shared/engine/settle-year';
import { irr } from '../../../shared/engine/finance';
import { atMostOneIrr, irrFast } from '../../../shared/engine/irr-fast';
import { toCents } from '../../oracles/cents';
import { decliningBalance, straightLine } from '../../oracles/depreciation';
import { loanSchedule } from '../../oracles/loan-schedule';

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

  it('walk several loans side by side, each to its decimal.js schedule', () => {
    // tests/oracles/loan-schedule.ts (decimal.js, half-up) is the reference for every loan; short
    // decimal rates (0.06 / 12 = 0.005) put half cents on many periods, so ties are walked too.
    fc.assert(
      fc.property(
        fc.array(fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 500_000_000 })), { minLength: 0, maxLength: 6 }),
        fc.oneof(fc.integer({ min: 0, max: 300 }).map((bp) => bp / 1000), fc.double({ min: 0, max: 0.3, noNaN: true })),
        fc.integer({ min: 1, max: 40 }),
        fc.constantFrom(1 as const, 2 as const, 4 as const, 12 as const),
        fc.integer({ min: 0, max: 60 }),
        (principalsCents, annualRate, years, paymentsPerYear, interestOnlyMonths) => {
          fc.pre(Math.ceil((interestOnlyMonths * paymentsPerYear) / 12) < years * paymentsPerYear);
          const principals = principalsCents.map((cents) => cents / 100);
          const walked = loanYearsSideBySide(principals, annualRate, years, paymentsPerYear, interestOnlyMonths);
          expect(walked).toHaveLength(principals.length);
          principals.forEach((principal, i) => {
            const ledger = loanSchedule({ principal, annualRate, years, paymentsPerYear, interestOnlyMonths });
            const zeros = new Array<number>(years).fill(0);
            // A loan of 0 has no schedule in the ledger: nothing owed or repaid in any year.
            expect(walked[i]?.interest).toEqual(principal === 0 ? zeros : ledger.years.map((y) => y.interest));
            expect(walked[i]?.principal).toEqual(principal === 0 ? zeros : ledger.years.map((y) => y.principal));
            expect(walked[i]?.closingBalance).toEqual(principal === 0 ? zeros : ledger.years.map((y) => y.closingBalance));
          });
        },
      ),
      { numRuns: 200 },
    );
    // Each loan's own errors, naming the field.
    expect(() => loanYearsSideBySide([1000, -1], 0.05, 10, 12, 0)).toThrow(/principal/);
  });

  it('free sums of whole cents of binary noise as Math.round(sum × 100) / 100 does', () => {
    // ECMA-262 Math.round (recalled from memory: the nearest integer, halves towards +∞, −0 for
    // −0.5 ≤ x < 0) is the reference, bit for bit; zero's sign included (Object.is).
    const reference = (sum: number): number => Math.round(sum * 100) / 100;
    for (const sum of [0, -0, 1e-12, -1e-12, 0.005, -0.005, 1.005, -1.005, 2 ** 49, -(2 ** 49) - 0.5, 2 ** 53, -(2 ** 60), Infinity, -Infinity]) {
      expect(Object.is(noiseFreeCents(sum), reference(sum))).toBe(true);
    }
    expect(Number.isNaN(noiseFreeCents(Number.NaN))).toBe(true);
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.double({ min: -1e-6, max: 1e-6, noNaN: true }), fc.double({ noNaN: true }), (cents, noise, any) => {
        const sum = cents / 100 + noise;
        expect(Object.is(noiseFreeCents(sum), reference(sum))).toBe(true);
        expect(Object.is(noiseFreeCents(any), reference(any))).toBe(true);
      }),
      { numRuns: 3000 },
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
    // Textbook annuity (docs/references.md, figures recompute exactly): 5000 at 9 % for 5 years → 1285.46, year-1 interest 450.00.
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

  it('round amounts beyond 2^42 through decimal.js, still equal to toCents', () => {
    // money.ts toCents is the reference (decimal.js half-up); 5e12 + 0.005 is a decimal tie.
    expect(roundCentsFast(5e12 + 0.005)).toBe(toCents(5e12 + 0.005));
    fc.assert(
      fc.property(fc.double({ min: 2 ** 41, max: 1e15, noNaN: true }), (amount) => {
        expect(roundCentsFast(amount) === toCents(amount)).toBe(true);
        expect(roundCentsFast(-amount) === toCents(-amount)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it('build the whole loan schedule in integer cents, equal to the decimal.js schedule', () => {
    // finance.ts loanSchedule (decimal.js, half-up, docs/model.md) is the reference. Rates with short
    // decimals (0.06 / 12 = 0.005) put half cents on many periods, so ties are exercised too.
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 1_000_000_000 }),
        fc.oneof(
          fc.integer({ min: 0, max: 300 }).map((bp) => bp / 1000),
          fc.integer({ min: 0, max: 3000 }).map((bp) => bp / 10_000),
          fc.double({ min: 0, max: 0.3, noNaN: true }),
        ),
        fc.integer({ min: 1, max: 40 }),
        fc.constantFrom(1 as const, 2 as const, 4 as const, 12 as const),
        fc.integer({ min: 0, max: 60 }),
        (principalCents, annualRate, years, paymentsPerYear, interestOnlyMonths) => {
          fc.pre(Math.ceil((interestOnlyMonths * paymentsPerYear) / 12) < years * paymentsPerYear);
          const input = { principal: principalCents / 100, annualRate, years, paymentsPerYear, interestOnlyMonths };
          expect(loanScheduleFast(input)).toEqual(loanSchedule(input));
        },
      ),
      { numRuns: 1500 },
    );
    // The same errors, naming the field.
    expect(() => loanScheduleFast({ principal: -1, annualRate: 0.05, years: 10, paymentsPerYear: 12 })).toThrow(/principal/);
    expect(() => loanScheduleFast({ principal: 1000, annualRate: 0.05, years: 1, paymentsPerYear: 12, interestOnlyMonths: 12 })).toThrow(/interestOnlyMonths/);
  });

  it('find the only IRR of flows that change sign several times when the running sums allow one root', () => {
    // Norstrom (1972), from memory: one sign change in the running sums → one IRR above 0; a late
    // replacement year (−20) changes the flows' sign twice more but not their running sums.
    const flows = [-100, 40, 40, -20, 40, 40, 30];
    expect(atMostOneIrr(flows)).toBe(true);
    const reference = irr(flows);
    expect(reference.value).not.toBeNull();
    expect(irrFast(flows).value).toBeCloseTo(reference.value ?? NaN, 9);
    // −100, 230, −132 has roots 10 % and 20 %: the criterion must not claim a single root.
    expect(atMostOneIrr([-100, 230, -132])).toBe(false);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: -50_000, max: 100_000 }), { minLength: 2, maxLength: 41 }), fc.double({ min: -0.5, max: 2, noNaN: true }), (flows, start) => {
        const reference = irr(flows);
        const fast = irrFast(flows, start);
        if (reference.value === null) expect(fast.value).toBeNull();
        else expect(fast.value).toBeCloseTo(reference.value, 9);
        if (fast.value === null && reference.value === null) expect('reason' in fast ? fast.reason : undefined).toBe(reference.reason);
      }),
      { numRuns: 1000 },
    );
  });
});
