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

/** The sign of presentValue at a rate, and how far above that rate it is sure to keep it. */
export interface SignReach {
  sign: number;
  /** Rate step (≥ 0): at every rate in [rate, rate + reach] presentValue has `sign`. */
  reach: number;
}

// Slack on the reach for the rounding of the slope bound and the margin (far above their error).
const REACH_SAFETY = 1e-6;

/**
 * The sign (−1, 0 or 1) that {@link presentValue}(rate, flows) has, written into `out`, found with
 * a running power of 1/(1 + rate) instead of a power per term: where the quick sum lies within its
 * rounding bound of zero, presentValue itself decides, so the sign is always presentValue's. With
 * it the reach of that sign: above
 * `rate` each term's slope |t·cf_t·(1 + r)^(−t−1)| only falls, so presentValue moves by at most
 * S = Σ t·|cf_t|·(1 + rate)^(−t−1) per unit of rate, and its rounding bound (which only falls
 * with the terms) stays under the one at `rate`; the sign therefore holds, in exact arithmetic
 * and in presentValue's own, while the rate has moved less than (|quick sum| − 2 × bound) ÷ S.
 * A scan of many rates need not evaluate the ones inside a reach: they have this sign.
 */
export function presentValueSignReach(rate: number, flows: readonly number[], out: SignReach): void {
  const v = 1 / (1 + rate);
  let power = 1;
  let total = 0;
  let magnitude = 0;
  let moment = 0;
  for (let t = 0; t < flows.length; t++) {
    const term = (flows[t] as number) * power;
    const size = Math.abs(term);
    total += term;
    magnitude += size;
    moment += t * size;
    power *= v;
  }
  const bound = SIGN_SAFETY_ULPS * (flows.length + 4) * Number.EPSILON * magnitude;
  if (Number.isFinite(magnitude) && Math.abs(total) > bound) {
    out.sign = total > 0 ? 1 : -1;
    const margin = Math.abs(total) - 2 * bound;
    const slope = moment * v * (1 + REACH_SAFETY);
    out.reach = margin <= 0 || !Number.isFinite(slope) ? 0 : slope === 0 ? Number.POSITIVE_INFINITY : margin / slope;
    return;
  }
  out.sign = Math.sign(presentValue(rate, flows));
  out.reach = 0;
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
