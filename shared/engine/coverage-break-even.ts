import type { Scenario } from '../schema';
import { coverageRatio } from './coverage';
import { loanDueIn, type ExistingFarm } from './farm-coverage';
import { cashAtMilk, type MilkModel, type OptionPlan } from './projection';
import { findRoot } from './root';

// A price to a millionth of the search range: far below a cent per tonne of milk.
const COVERAGE_PRICE_TOLERANCE = 1e-6;

export type CoverageBreakEvenReason = 'none-in-range' | 'no-debt-service';

/**
 * Milk prices (currency per kg, today's money, grown as every price) at which an option's lowest
 * whole-farm coverage is exactly 1.0 and exactly the lender's threshold; null with a reason.
 */
export interface CoverageBreakEven {
  atOne: number | null;
  atOneReason?: CoverageBreakEvenReason;
  atThreshold: number | null;
  atThresholdReason?: CoverageBreakEvenReason;
}

/**
 * Brent's method on the lowest whole-farm coverage as a function of the milk price, in
 * [0, priceHi]: (existing cash beside the herd + the option's cash for debt service at that
 * price) ÷ (existing debt + its loan), lowest over the years with something due. The existing
 * farm takes the same price (its herd margin is the current option's), so only the option's own
 * cash moves against the fixed figure beside the herd. The lowest ratio rises with the price, so
 * a root is unique.
 */
export function breakEvenMilkPriceForCoverage(
  scenario: Scenario,
  farm: ExistingFarm,
  model: MilkModel,
  plan: OptionPlan,
  priceHi: number,
): CoverageBreakEven {
  const cash = new Array<number>(plan.horizon + 1).fill(0);
  const response = scenario.herd.lyingResponseKgPerHour;
  const lowestAt = (price: number): number | null => {
    cashAtMilk(model, plan, scenario.finance, 0, price, response, cash);
    let lowest: number | null = null;
    for (let t = 1; t <= plan.horizon; t++) {
      const ratio = coverageRatio(farm.cashBesideHerd + (cash[t] ?? 0), (farm.debtByYear[t] ?? 0) + loanDueIn(plan, t));
      if (ratio !== null && (lowest === null || ratio < lowest)) lowest = ratio;
    }
    return lowest;
  };
  if (lowestAt(scenario.herd.milkPricePerKg) === null) {
    return { atOne: null, atOneReason: 'no-debt-service', atThreshold: null, atThresholdReason: 'no-debt-service' };
  }
  const solve = (target: number): { value: number | null; reason?: CoverageBreakEvenReason } => {
    const root = findRoot((price) => (lowestAt(price) ?? 0) - target, 0, priceHi, { tolerance: priceHi * COVERAGE_PRICE_TOLERANCE });
    return root.value === null ? { value: null, reason: 'none-in-range' } : { value: root.value };
  };
  const one = solve(1);
  const threshold = solve(scenario.finance.coverageThreshold);
  return {
    atOne: one.value,
    ...(one.reason ? { atOneReason: one.reason } : {}),
    atThreshold: threshold.value,
    ...(threshold.reason ? { atThresholdReason: threshold.reason } : {}),
  };
}
