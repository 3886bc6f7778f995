/**
 * The engine's one present value and its one sign-change count: every NPV, discounted series
 * and IRR test goes through these, so the figures on every path share their arithmetic.
 */
import { powerTable } from './powers';

const discountDivisor = powerTable();

/**
 * Present value Σ flows[t] / (1 + rate)^t (currency), flows[0] at t = 0 undiscounted (the numpy /
 * `financial` npv convention); rate a fraction per period above −1. No checks: finance.ts npv
 * checks its inputs and calls this.
 */
export function presentValue(rate: number, flows: readonly number[]): number {
  let total = 0;
  for (let t = 0; t < flows.length; t++) total += (flows[t] as number) / discountDivisor(rate, t);
  return total;
}

// Margin on the quick sum's rounding: it and presentValue each err by a few ulps per term
// (running power or pow, the division, the sum), far below this many ulps of the terms' size.
const SIGN_SAFETY_ULPS = 8;

/**
 * The sign (−1, 0 or 1) that {@link presentValue}(rate, flows) has, found with a running power of
 * 1/(1 + rate) instead of a power per term: where the quick sum lies within its rounding bound of
 * zero, presentValue itself decides, so the answer is always presentValue's sign. The IRR grid
 * scan only needs signs.
 */
export function presentValueSign(rate: number, flows: readonly number[]): number {
  const v = 1 / (1 + rate);
  let power = 1;
  let total = 0;
  let magnitude = 0;
  for (let t = 0; t < flows.length; t++) {
    const term = (flows[t] as number) * power;
    total += term;
    magnitude += Math.abs(term);
    power *= v;
  }
  const bound = SIGN_SAFETY_ULPS * (flows.length + 4) * Number.EPSILON * magnitude;
  if (Number.isFinite(magnitude) && Math.abs(total) > bound) return total > 0 ? 1 : -1;
  return Math.sign(presentValue(rate, flows));
}

/** Each flow's present value flows[t] / (1 + rate)^t (currency), the terms {@link presentValue} adds. */
export function presentValues(rate: number, flows: readonly number[]): number[] {
  return flows.map((cf, t) => cf / (1 + rate) ** t);
}

/** Sign changes along a series (count), zeros skipped, as Descartes' rule of signs counts them. */
export function signChanges(values: readonly number[]): number {
  let changes = 0;
  let previous = 0;
  for (const value of values) {
    if (value === 0) continue;
    const sign = value > 0 ? 1 : -1;
    if (previous !== 0 && sign !== previous) changes++;
    previous = sign;
  }
  return changes;
}
