import { signChanges } from './discounting';
import { IRR_RANGE, irr, type IrrResult } from './finance';

/** Where {@link npvAt} writes the derivative: one per search, not a pair per step. */
interface Slope {
  value: number;
}

// NPV at rate r (returned) and its derivative d/dr (written to slopeOut.value), flows[0] at t = 0:
// no pair allocated per step, as this runs several times for every option of every Monte Carlo draw.
function npvAt(flows: readonly number[], rate: number, slopeOut: Slope): number {
  const v = 1 / (1 + rate);
  let power = 1;
  let value = 0;
  let slope = 0;
  for (let t = 0; t < flows.length; t++) {
    const cf = flows[t] as number;
    value += cf * power;
    slope -= t * cf * power * v;
    power *= v;
  }
  slopeOut.value = slope;
  return value;
}

/** Sign changes of the running sums of the flows (zeros skipped, as signChanges counts), from the first flow onwards or from the last one backwards. */
function runningSumSignChanges(flows: readonly number[], fromEnd: boolean): number {
  const n = flows.length;
  let changes = 0;
  let previous = 0;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    sum += flows[fromEnd ? n - 1 - i : i] as number;
    if (sum === 0) continue;
    const sign = sum > 0 ? 1 : -1;
    if (previous !== 0 && sign !== previous) changes++;
    previous = sign;
  }
  return changes;
}

/**
 * True when NPV has at most one root for rates above −100 %, so a bracketed search finds the
 * only IRR. Norstrom's criterion, both ways: with v = 1/(1 + r), NPV/(1 − v) is a power series
 * in v whose coefficients are the running sums S_0..S_n, so Descartes' rule bounds the roots with
 * r > 0 by their sign changes; the running sums from the last flow bound the roots with
 * −1 < r < 0 the same way (in w = 1 + r); r = 0 is a root when the flows sum to 0.
 */
export function atMostOneIrr(flows: readonly number[]): boolean {
  let total = 0;
  for (const cf of flows) total += cf;
  const bound = runningSumSignChanges(flows, false) + runningSumSignChanges(flows, true) + (total === 0 ? 1 : 0);
  return bound <= 1;
}

const TOLERANCE = 1e-13;
const MAX_ITERATIONS = 200;
const DEFAULT_START = 0.1;

/**
 * IRR per year (flows[0] at t = 0), as finance.ts irr over the same range [−0.99, 10], for the
 * fast path. When the root is unique — one sign change in the flows, or several but
 * {@link atMostOneIrr} — it runs a bracketed Newton search from `start` (a fraction per year;
 * e.g. the IRR of the unperturbed scenario in a Monte Carlo draw); otherwise it defers to
 * finance.ts irr, so the two agree on every input.
 */
export function irrFast(flows: readonly number[], start = DEFAULT_START): IrrResult {
  const changes = signChanges(flows);
  if (changes === 0 || (changes > 1 && !atMostOneIrr(flows))) return irr(flows);
  let lo: number = IRR_RANGE.lo;
  let hi: number = IRR_RANGE.hi;
  const slopeOut: Slope = { value: 0.5 };
  const fLo = npvAt(flows, lo, slopeOut);
  const fHi = npvAt(flows, hi, slopeOut);
  if (fLo === 0) return { value: lo };
  if (fHi === 0) return { value: hi };
  if (fLo > 0 === fHi > 0) return { value: null, reason: 'no-root' };
  // Keep f(neg) < 0 < f(pos) so the bracket update does not depend on the slope's sign.
  let neg = fLo < 0 ? lo : hi;
  let pos = fLo < 0 ? hi : lo;
  let rate = Number.isFinite(start) && start > lo && start < hi ? start : DEFAULT_START;
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    const value = npvAt(flows, rate, slopeOut);
    const slope = slopeOut.value;
    if (value === 0) return { value: rate };
    if (value < 0) neg = rate;
    else pos = rate;
    lo = Math.min(neg, pos);
    hi = Math.max(neg, pos);
    let next = slope !== 0 ? rate - value / slope : Number.NaN;
    if (!(next > lo && next < hi)) next = (lo + hi) / 2;
    if (Math.abs(next - rate) <= TOLERANCE * (1 + Math.abs(rate))) return { value: next };
    rate = next;
  }
  return { value: rate };
}
