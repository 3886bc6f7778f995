import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Decimal from 'decimal.js';
import { pmt } from 'financial';
import type { LoanSchedule } from '@shared/engine/finance';
import { loanSchedule } from '../../oracles/loan-schedule';

function hasAtMostTwoDecimals(x: number): boolean {
  return new Decimal(x).decimalPlaces() <= 2;
}

function sumOf(values: readonly number[]): Decimal {
  return values.reduce((s, v) => s.plus(v), new Decimal(0));
}

function allAmounts(schedule: LoanSchedule): number[] {
  return [
    ...schedule.payments.flatMap((p) => [p.payment, p.interest, p.principal, p.balance]),
    ...schedule.years.flatMap((y) => [y.payment, y.interest, y.principal, y.closingBalance]),
    schedule.totalInterest,
    schedule.totalPrincipal,
  ];
}

describe('loanSchedule — published examples', () => {
  it('pays 1 285.46 a year with 450.00 interest in year 1 on 5 000 at 9 % over 5 years', () => {
    // standard annuity formula / textbook amortisation tables (docs/references.md; memory for the book, figures recompute)
    const schedule = loanSchedule({ principal: 5000, annualRate: 0.09, years: 5, paymentsPerYear: 1 });
    expect(schedule.payments[0]).toMatchObject({ payment: 1285.46, interest: 450, principal: 835.46, balance: 4164.54 });
  });

  it('follows the hand-worked amortisation table to the last cent', () => {
    // hand calculation, interest = opening balance × 9 % rounded half-up:
    // y2 4164.54 × 0.09 = 374.8086 → 374.81, principal 910.65, balance 3253.89
    // y3 3253.89 × 0.09 = 292.8501 → 292.85, principal 992.61, balance 2261.28
    // y4 2261.28 × 0.09 = 203.5152 → 203.52, principal 1081.94, balance 1179.34
    // y5 1179.34 × 0.09 = 106.1406 → 106.14, principal 1179.34, payment 1285.48 (absorbs rounding)
    const schedule = loanSchedule({ principal: 5000, annualRate: 0.09, years: 5, paymentsPerYear: 1 });
    expect(schedule.payments.map((p) => p.interest)).toEqual([450, 374.81, 292.85, 203.52, 106.14]);
    expect(schedule.payments.map((p) => p.balance)).toEqual([4164.54, 3253.89, 2261.28, 1179.34, 0]);
    expect(schedule.payments[4]?.payment).toBe(1285.48);
    // hand calculation: 450 + 374.81 + 292.85 + 203.52 + 106.14
    expect(schedule.totalInterest).toBe(1427.32);
    expect(schedule.totalPrincipal).toBe(5000);
  });

  it('pays 1 854.02 a month on 200 000 at 7.5 % over 15 years', () => {
    // numpy pmt documentation (read): −1 854.02472 a month, rounded half-up to cents;
    // hand calculation: first interest 200 000 × 0.075 / 12 = 1 250.00
    const schedule = loanSchedule({ principal: 200_000, annualRate: 0.075, years: 15, paymentsPerYear: 12 });
    expect(schedule.payments).toHaveLength(180);
    expect(schedule.payments[0]).toMatchObject({ payment: 1854.02, interest: 1250, principal: 604.02 });
    expect(schedule.years[0]?.payment).toBe(new Decimal(1854.02).times(12).toNumber());
  });

  it('spreads a zero-rate loan evenly, the last payment taking the odd cent', () => {
    // hand calculation: 1000 / 3 = 333.33 twice, then 333.34
    const schedule = loanSchedule({ principal: 1000, annualRate: 0, years: 3, paymentsPerYear: 1 });
    expect(schedule.payments.map((p) => p.payment)).toEqual([333.33, 333.33, 333.34]);
    expect(schedule.totalInterest).toBe(0);
  });

  it('pays interest only for the months given, rounded up to whole periods', () => {
    // hand calculation: 4 months on quarterly payments → ceil(4 × 4 / 12) = 2 periods of
    // 12 000 × 0.06 / 4 = 180.00 interest and no principal
    const schedule = loanSchedule({
      principal: 12_000,
      annualRate: 0.06,
      years: 2,
      paymentsPerYear: 4,
      interestOnlyMonths: 4,
    });
    expect(schedule.payments.slice(0, 2).map((p) => [p.payment, p.interest, p.principal, p.balance])).toEqual([
      [180, 180, 0, 12_000],
      [180, 180, 0, 12_000],
    ]);
    // second reference: `financial` pmt over the 6 remaining quarters, rounded to cents
    const level = Math.round(-pmt(0.015, 6, 12_000) * 100) / 100;
    expect(schedule.payments[2]?.payment).toBe(level);
  });

  it('returns an empty schedule for a zero principal', () => {
    // definition: nothing borrowed, nothing repaid
    expect(loanSchedule({ principal: 0, annualRate: 0.05, years: 10, paymentsPerYear: 12 })).toEqual({
      payments: [],
      years: [],
      totalInterest: 0,
      totalPrincipal: 0,
    });
  });
});

describe('loanSchedule — rejects bad input', () => {
  it('names the field at fault', () => {
    const base = { principal: 1000, annualRate: 0.05, years: 5, paymentsPerYear: 12 as const };
    expect(() => loanSchedule({ ...base, principal: -1 })).toThrow(/principal/);
    expect(() => loanSchedule({ ...base, annualRate: Number.NaN })).toThrow(/annualRate/);
    expect(() => loanSchedule({ ...base, years: 0 })).toThrow(/years/);
    expect(() => loanSchedule({ ...base, paymentsPerYear: 3 as unknown as 12 })).toThrow(/paymentsPerYear/);
    expect(() => loanSchedule({ ...base, interestOnlyMonths: 60 })).toThrow(/interestOnlyMonths/);
  });
});

describe('loanSchedule — invariants', () => {
  const loanArb = fc.record({
    principal: fc.integer({ min: 1, max: 500_000_000 }).map((cents) => cents / 100),
    annualRate: fc.oneof(fc.constant(0), fc.double({ min: 0.0001, max: 0.2, noNaN: true })),
    years: fc.integer({ min: 1, max: 40 }),
    paymentsPerYear: fc.constantFrom(1 as const, 2 as const, 4 as const, 12 as const),
    interestOnlyMonths: fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 36 })),
  });

  it('repays the principal exactly in cents, ends at 0.00 and keeps every amount in cents', () => {
    // definition of an amortising loan; cents rule from docs/model.md (decimal.js, half-up, last payment absorbs)
    fc.assert(
      fc.property(loanArb, (loan) => {
        const periods = loan.years * loan.paymentsPerYear;
        const interestOnly = Math.ceil((loan.interestOnlyMonths * loan.paymentsPerYear) / 12);
        fc.pre(interestOnly < periods);
        const schedule = loanSchedule(loan);

        expect(schedule.payments).toHaveLength(periods);
        expect(schedule.years).toHaveLength(loan.years);
        expect(sumOf(schedule.payments.map((p) => p.principal)).toNumber()).toBe(loan.principal);
        expect(schedule.totalPrincipal).toBe(loan.principal);
        expect(schedule.payments.at(-1)?.balance).toBe(0);
        expect(schedule.years.at(-1)?.closingBalance).toBe(0);
        expect(allAmounts(schedule).every(hasAtMostTwoDecimals)).toBe(true);

        for (const p of schedule.payments) {
          expect(new Decimal(p.interest).plus(p.principal).toNumber()).toBe(p.payment);
          expect(p.balance).toBeGreaterThanOrEqual(0);
          expect(p.principal).toBeGreaterThanOrEqual(0);
        }
        for (const p of schedule.payments.slice(0, interestOnly)) {
          expect(p.principal).toBe(0);
          expect(p.balance).toBe(loan.principal);
        }
        expect(sumOf(schedule.payments.map((p) => p.interest)).toNumber()).toBe(schedule.totalInterest);
        for (const y of schedule.years) {
          const inYear = schedule.payments.filter((p) => p.year === y.year);
          expect(inYear).toHaveLength(loan.paymentsPerYear);
          expect(sumOf(inYear.map((p) => p.payment)).toNumber()).toBe(y.payment);
          expect(y.closingBalance).toBe(inYear.at(-1)?.balance);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('keeps level payments on the amortising part, only the last one differing', () => {
    // definition of a level-payment (annuity) loan
    fc.assert(
      fc.property(loanArb, (loan) => {
        const periods = loan.years * loan.paymentsPerYear;
        const interestOnly = Math.ceil((loan.interestOnlyMonths * loan.paymentsPerYear) / 12);
        fc.pre(interestOnly < periods - 1 && loan.principal >= 1000);
        const amortising = loanSchedule(loan).payments.slice(interestOnly, -1);
        expect(new Set(amortising.map((p) => p.payment)).size).toBe(1);
      }),
      { numRuns: 200 },
    );
  });
});
