/** decimal.js rounding to cents: the reference `roundCentsFast` (shared/engine/cents.ts) is pinned to. */
import { requireFinite, roundCents } from '../../shared/engine/money';

/**
 * Rounds a currency amount to cents, half-up (ties away from zero), and returns a JS number.
 * The number is read through its shortest decimal form, so 1.005 rounds to 1.01 (where
 * `Math.round(1.005 * 100) / 100` gives 1.00 because of binary floating point).
 */
export function toCents(x: number): number {
  requireFinite('x', x);
  return roundCents(x).toNumber();
}
