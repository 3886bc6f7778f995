import type { Option, Scenario } from '../schema';
import { roundCentsFast } from './cents';
import { projectOption, type OptionPlan } from './projection';

/**
 * An option's plan with today's herd in every year (cows = year-0 cows, every newcomer gone): the
 * same build, loan and tax depreciation, no herd purchases and no herd value at the horizon.
 */
export function atTodaysHerd(plan: OptionPlan): OptionPlan {
  const today = plan.cows[0] ?? 0;
  const cows = plan.cows.map(() => today);
  return { ...plan, cows, milkCows: cows, herdPurchasesByYear: cows.map(() => 0), herdValueAtHorizon: 0 };
}

/** True when the plan's herd differs from today's in some year. */
export function changesHerd(plan: OptionPlan): boolean {
  const today = plan.cows[0] ?? 0;
  return plan.cows.some((cows) => cows !== today);
}

/** One side of the change as the split needs it: the option, its plan and its project flows. */
export interface SplitSide {
  option: Option;
  plan: OptionPlan;
  cashFlows: readonly number[];
}

/**
 * The change against the current option in two parts, year by year (currency, cents; index =
 * year): *housing, today's herd* = the option with today's herd − the current option with
 * today's herd; *expansion* = the whole change − that part, i.e. what the added cows bring and
 * cost (milk, feed, labour, replacement, purchases, their herd value at H, the tax on it). The
 * build stays as planned in both parts, so stalls built for the added cows sit in the housing
 * part. The two add up to the change exactly; null when neither side changes the herd.
 */
export function expansionSplitFlows(scenario: Scenario, option: SplitSide, current: SplitSide, currentLyingHours: number): { housingTodaysHerd: number[]; expansion: number[] } | null {
  if (!changesHerd(option.plan) && !changesHerd(current.plan)) return null;
  const todays = (side: SplitSide): readonly number[] =>
    changesHerd(side.plan) ? projectOption(scenario, side.option, atTodaysHerd(side.plan), currentLyingHours, false).cashFlows : side.cashFlows;
  const optionToday = todays(option);
  const currentToday = todays(current);
  const housingTodaysHerd = optionToday.map((cf, t) => roundCentsFast(cf - (currentToday[t] ?? 0)));
  const expansion = option.cashFlows.map((cf, t) => roundCentsFast(cf - (current.cashFlows[t] ?? 0) - (housingTodaysHerd[t] ?? 0)));
  return { housingTodaysHerd, expansion };
}
