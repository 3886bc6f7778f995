import type { Scenario } from '../schema';
import { coverageRatio } from './coverage';
import { loanDueIn, type ExistingFarm } from './farm-coverage';
import { flowsAtPrice, type MilkAtResponse, type OptionPlan } from './projection';
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
 * a root is unique. `milk` is the option's milk model at the herd's lying-time response.
 */
export function breakEvenMilkPriceForCoverage(
  scenario: Scenario,
  farm: ExistingFarm,
  milk: MilkAtResponse,
  plan: OptionPlan,
  priceHi: number,
): CoverageBreakEven {
  const cash = new Array<number>(plan.horizon + 1).fill(0);
  // Each price is evaluated once: both searches start from the ends of the range, and the second
  // may start at the first one's root.
  const seen = new Map<number, number | null>();
  const lowestAt = (price: number): number | null => {
    const known = seen.get(price);
    if (known !== undefined) return known;
    flowsAtPrice(milk, plan, scenario.finance, 0, price, null, cash);
    let lowest: number | null = null;
    for (let t = 1; t <= plan.horizon; t++) {
      const ratio = coverageRatio(farm.cashBesideHerd + (cash[t] ?? 0), (farm.debtByYear[t] ?? 0) + loanDueIn(plan, t));
      if (ratio !== null && (lowest === null || ratio < lowest)) lowest = ratio;
    }
    seen.set(price, lowest);
    return lowest;
  };
  if (lowestAt(scenario.herd.milkPricePerKg) === null) {
    return { atOne: null, atOneReason: 'no-debt-service', atThreshold: null, atThresholdReason: 'no-debt-service' };
  }
  const solve = (target: number, from = 0): { value: number | null; reason?: CoverageBreakEvenReason } => {
    const root = findRoot((price) => (lowestAt(price) ?? 0) - target, from, priceHi, { tolerance: priceHi * COVERAGE_PRICE_TOLERANCE });
    return root.value === null ? { value: null, reason: 'none-in-range' } : { value: root.value };
  };
  const one = solve(1);
  const target = scenario.finance.coverageThreshold;
  // The lowest ratio rises with the price: a threshold above 1 is reached above the price for 1.
  const threshold = solve(target, target > 1 && one.value !== null && one.value < priceHi ? one.value : 0);
  return {
    atOne: one.value,
    ...(one.reason ? { atOneReason: one.reason } : {}),
    atThreshold: threshold.value,
    ...(threshold.reason ? { atThresholdReason: threshold.reason } : {}),
  };
}
