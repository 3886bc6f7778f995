import type { GrowthKey, RunningCostLine } from '../schema';

/** Yearly amounts in today's money per price group a line follows (currency/yr; negative = a saving). */
export type RunningCostsByGrowth = Record<GrowthKey, number>;

/** Growth factors of year t per price group (unitless, 1 = today's prices); 'none' never grows. */
export type GrowthFactors = Record<Exclude<GrowthKey, 'none'>, number>;

/** An option's running-cost lines summed per price group they grow with (currency/yr, today's money). */
export function runningCostsByGrowth(lines: readonly RunningCostLine[]): RunningCostsByGrowth {
  const byGrowth: RunningCostsByGrowth = { milkPrice: 0, feed: 0, wages: 0, bedding: 0, fertiliser: 0, general: 0, none: 0 };
  for (const line of lines) byGrowth[line.growth] += line.amountPerYear;
  return byGrowth;
}

/** The running costs of year t (currency/yr, unrounded): each group's amount × its growth factor; 'none' as entered. */
export function grownRunningCosts(byGrowth: RunningCostsByGrowth, factors: GrowthFactors): number {
  return (
    byGrowth.milkPrice * factors.milkPrice +
    byGrowth.feed * factors.feed +
    byGrowth.wages * factors.wages +
    byGrowth.bedding * factors.bedding +
    byGrowth.fertiliser * factors.fertiliser +
    byGrowth.general * factors.general +
    byGrowth.none
  );
}
