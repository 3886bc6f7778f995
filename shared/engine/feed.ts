import { MILK_DAYS_PER_YEAR } from './yield';

/** Grazing days per year (days/yr): the days not housed, never negative (366 housed days → 0). */
export function grazingDaysPerYear(housedDays: number): number {
  return Math.max(0, MILK_DAYS_PER_YEAR - housedDays);
}

/** Housed days the engine counts (days/yr): capped at 365 so housed + grazing days make one year. */
export function effectiveHousedDays(housedDays: number): number {
  return Math.min(Math.max(0, housedDays), MILK_DAYS_PER_YEAR);
}

/**
 * Base feed cost per year in today's money (currency/yr):
 * N · (housed days · housed cost + grazing days · grazing cost).
 */
export function baseFeedCostPerYear(cows: number, housedDays: number, housedCostPerCowDay: number, grazingCostPerCowDay: number): number {
  const housed = effectiveHousedDays(housedDays);
  return cows * (housed * housedCostPerCowDay + grazingDaysPerYear(housed) * grazingCostPerCowDay);
}

/**
 * Marginal feed cost of extra milk in today's money (currency/yr): extra kg × cost per kg.
 * Extra milk below the baseline yield is negative and saves feed.
 */
export function marginalFeedCostPerYear(extraMilkKgPerYear: number, costPerKgMilk: number): number {
  return extraMilkKgPerYear * costPerKgMilk;
}
