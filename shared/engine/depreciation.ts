import type Decimal from 'decimal.js';
import { Money, requireFinite, requireNonNegative, requirePositiveInteger, roundCents } from './money';

// Every schedule here is in currency per year, years 1..n, rounded to cents half-up; the last
// year takes what rounding left over so the schedule sums exactly to the depreciable amount.

function centsSchedule(rawAmounts: readonly Decimal[], total: Decimal): number[] {
  let booked = new Money(0);
  return rawAmounts.map((raw, i) => {
    const amount = i === rawAmounts.length - 1 ? total.minus(booked) : roundCents(raw);
    booked = booked.plus(amount);
    return amount.toNumber();
  });
}

/** Straight-line depreciation: (cost − salvage) / life in each of `life` years. */
export function straightLine(cost: number, life: number, salvage = 0): number[] {
  requireNonNegative('cost', cost);
  requirePositiveInteger('life', life);
  requireNonNegative('salvage', salvage);
  if (salvage > cost) throw new RangeError(`salvage must not exceed cost (got salvage ${salvage}, cost ${cost})`);
  const base = roundCents(cost).minus(roundCents(salvage));
  const yearly = base.div(life);
  return centsSchedule(Array.from({ length: life }, () => yearly), base);
}

/**
 * Declining-balance depreciation to zero salvage, full-year convention: each year the larger of
 * book × factor / life and straight line of the book value over the years left, so it switches
 * to straight line in the first year that straight line gives more (and ends at zero book value).
 * `factor` 2 is double declining balance, 1.5 is 150 % declining balance.
 */
export function decliningBalance(cost: number, life: number, factor: number): number[] {
  requireNonNegative('cost', cost);
  requirePositiveInteger('life', life);
  requireFinite('factor', factor);
  if (factor <= 0) throw new RangeError(`factor must be > 0 (got ${factor})`);
  const total = roundCents(cost);
  const rate = new Money(factor).div(life);
  let book = total;
  const amounts: Decimal[] = [];
  for (let year = 1; year <= life; year++) {
    const declining = book.times(rate);
    const straight = book.div(life - year + 1);
    const amount = roundCents(Money.min(Money.max(declining, straight), book));
    amounts.push(amount);
    book = book.minus(amount);
  }
  return centsSchedule(amounts, total);
}

export type MacrsTable = {
  readonly recoveryYears: number;
  readonly method: '200% declining balance' | '150% declining balance';
  readonly convention: 'half-year';
  /** Percent of the unadjusted basis deducted in tax years 1..recoveryYears + 1. */
  readonly percentages: readonly number[];
  readonly source: string;
};

/** US MACRS GDS 10-year property (single-purpose agricultural structures), 200 % DB, half-year. */
export const MACRS_10_YEAR_200DB: MacrsTable = {
  recoveryYears: 10,
  method: '200% declining balance',
  convention: 'half-year',
  percentages: [10.0, 18.0, 14.4, 11.52, 9.22, 7.37, 6.55, 6.55, 6.56, 6.55, 3.28],
  source: 'IRS Publication 946, Table A-1',
};

/** US MACRS GDS 10-year property, 150 % DB, half-year: farm property may elect 150 % DB (required before 2018, from memory). */
export const MACRS_10_YEAR_150DB: MacrsTable = {
  recoveryYears: 10,
  method: '150% declining balance',
  convention: 'half-year',
  percentages: [7.5, 13.88, 11.79, 10.02, 8.74, 8.74, 8.74, 8.74, 8.74, 8.74, 4.37],
  source: 'IRS Publication 946, Table A-14',
};

/** US MACRS GDS 20-year property (general farm buildings), 150 % DB, half-year. */
export const MACRS_20_YEAR_150DB: MacrsTable = {
  recoveryYears: 20,
  method: '150% declining balance',
  convention: 'half-year',
  percentages: [
    3.75, 7.219, 6.677, 6.177, 5.713, 5.285, 4.888, 4.522, 4.462, 4.461, 4.462, 4.461, 4.462, 4.461, 4.462,
    4.461, 4.462, 4.461, 4.462, 4.461, 2.231,
  ],
  source: 'IRS Publication 946, Table A-1',
};

/** MACRS depreciation by tax year (currency per year): cost × the table's percentage for each year. */
export function macrsSchedule(cost: number, table: MacrsTable): number[] {
  requireNonNegative('cost', cost);
  const total = roundCents(cost);
  return centsSchedule(
    table.percentages.map((pct) => total.times(pct).div(100)),
    total,
  );
}

/**
 * Residual (salvage) value, currency: cost × remaining life / life on a straight line,
 * 0 once the asset is `life` years old or older.
 */
export function residualValueStraightLine(cost: number, life: number, ageYears: number): number {
  requireNonNegative('cost', cost);
  requireFinite('life', life);
  if (life <= 0) throw new RangeError(`life must be > 0 (got ${life})`);
  requireNonNegative('ageYears', ageYears);
  const remaining = Math.max(0, life - ageYears);
  return roundCents(new Money(cost).times(remaining).div(life)).toNumber();
}
