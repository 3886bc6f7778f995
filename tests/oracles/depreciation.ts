/**
 * The decimal.js depreciation schedules and straight-line residual value: the references the
 * float twins in shared/engine/cents.ts (straightLineFast, decliningBalanceFast, macrsFast) and
 * capital.ts salvage are pinned to. Kept under tests: the product runs the twins.
 */
import type Decimal from 'decimal.js';
import type { MacrsTable } from '../../shared/engine/depreciation';
import { Money, requireFinite, requireNonNegative, requirePositiveInteger, roundCents } from '../../shared/engine/money';

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
