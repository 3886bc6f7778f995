import { paybackYears } from './finance';
import type { PaybackReason, YearLine } from './results';

/**
 * An option's flows from operations (currency, index = year): year 0 as the project flow; year t
 * = cash available for debt service − replacements − herd purchases, which equals the project
 * flow except in year H, where it leaves out the salvage, the herd value and the tax on the
 * disposal gain (valuations at the horizon, not cash the operations earn).
 */
export function operationsFlows(lines: readonly YearLine[]): number[] {
  return lines.map((line) => (line.year === 0 ? line.netCashFlow : line.cashAvailableForDebtService - line.replacements - line.herdPurchases));
}

export interface OperationsPayback {
  paybackFromOperationsYears: number | null;
  paybackFromOperationsReason?: PaybackReason;
  /** Share of the change's year-0 outlay its operations recover over the horizon (fraction); null without an outlay. */
  operationsRecoveredShare: number | null;
}

/**
 * Payback of the change from operations alone (years, interpolated as finance.ts paybackYears):
 * the incremental flows without the year-H salvage and herd value. Null with 'no-net-investment'
 * when the change needs no outlay at year 0, 'not-within-horizon' when never reached.
 */
export function operationsPayback(own: readonly YearLine[], current: readonly YearLine[]): OperationsPayback {
  const currentFlows = operationsFlows(current);
  const flows = operationsFlows(own).map((cf, t) => Math.round((cf - (currentFlows[t] ?? 0)) * 100) / 100);
  const outlay = flows[0] ?? 0;
  if (outlay >= 0) return { paybackFromOperationsYears: null, paybackFromOperationsReason: 'no-net-investment', operationsRecoveredShare: null };
  let recovered = 0;
  for (let t = 1; t < flows.length; t++) recovered += flows[t] ?? 0;
  const payback = paybackYears(flows);
  return {
    paybackFromOperationsYears: payback,
    ...(payback === null ? { paybackFromOperationsReason: 'not-within-horizon' as const } : {}),
    operationsRecoveredShare: recovered / -outlay,
  };
}
