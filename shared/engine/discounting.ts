/**
 * The engine's one present value and its one sign-change count: every NPV, discounted series
 * and IRR test goes through these, so the figures on every path share their arithmetic.
 */
import { powerTable } from './powers';

/**
 * Present value Σ flows[t] / (1 + rate)^t (currency), flows[0] at t = 0 undiscounted (the numpy /
 * `financial` npv convention); rate a fraction per period above −1. No checks: finance.ts npv
 * checks its inputs and calls this.
 */
export function presentValue(rate: number, flows: readonly number[]): number {
  let total = 0;
  for (let t = 0; t < flows.length; t++) total += (flows[t] ?? 0) / discountDivisor(rate, t);
  return total;
}

const discountDivisor = powerTable();

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
