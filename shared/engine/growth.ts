import type { GrowthRates } from '../schema';
import { powerTable } from './powers';

/**
 * Growth factor (unitless) for a price entered in today's money (year 0) and grown at a
 * nominal yearly rate: (1 + rate)^year, so year-1 values carry one year of growth.
 */
export function growthFactor(rate: number, year: number): number {
  return grownBy(rate, year);
}

const grownBy = powerTable();

/** The yearly growth of every price group (fractions per year), each one the farm left empty at general inflation. */
export type ResolvedGrowthRates = { [Key in keyof GrowthRates]: number };

/** Every price group's growth (fraction per year): the farm's own rate, or general inflation when it entered none. */
export function resolvedGrowth(growth: GrowthRates): ResolvedGrowthRates {
  const { general } = growth;
  return {
    milkPrice: growth.milkPrice ?? general,
    feed: growth.feed ?? general,
    wages: growth.wages ?? general,
    bedding: growth.bedding ?? general,
    fertiliser: growth.fertiliser ?? general,
    general,
  };
}

/**
 * How much slower milk grows than feed (fraction per year, > 0 when milk lags): a gap the farm
 * should see, because over 20 years it alone can turn a barn's NPV from gain to loss.
 */
export function milkLagsFeedBy(growth: GrowthRates): number {
  const rates = resolvedGrowth(growth);
  return rates.feed - rates.milkPrice;
}
