import { growthFactor } from './growth';

export interface HerdChange {
  cowsByYear: readonly number[] | null;
  addedCows: number;
}

/**
 * Cows per year (head), index = year: [0] is today's herd; years 1..H follow cowsByYear (its last
 * value carrying on) or today's herd + added cows, never below 0.
 */
export function cowsPerYear(baselineCows: number, change: HerdChange, horizon: number, herdMultiplier = 1): number[] {
  const cows = new Array<number>(horizon + 1);
  cows[0] = baselineCows * herdMultiplier;
  const listed = change.cowsByYear;
  for (let year = 1; year <= horizon; year++) {
    const raw = listed && listed.length > 0
      ? (listed[Math.min(year, listed.length) - 1] ?? baselineCows)
      : baselineCows + change.addedCows;
    cows[year] = Math.max(0, raw * herdMultiplier);
  }
  return cows;
}

/**
 * Herd purchases per year (currency), index = year: cows joining in year t are bought at the end
 * of year t − 1 at the added-cow cost grown by inflation; cows leaving are sold at the cull value
 * (a negative purchase). The horizon year holds no purchase.
 */
export function herdPurchasesByYear(cows: readonly number[], addedCowCost: number, cullValue: number, inflation: number): number[] {
  const horizon = cows.length - 1;
  const byYear = new Array<number>(horizon + 1).fill(0);
  for (let year = 1; year <= horizon; year++) {
    const change = (cows[year] ?? 0) - (cows[year - 1] ?? 0);
    if (change === 0) continue;
    const price = change >= 0 ? addedCowCost : cullValue;
    byYear[year - 1] = change * price * growthFactor(inflation, year - 1);
  }
  return byYear;
}

/**
 * Value at the horizon of the herd change (currency): (cows at H − cows today) × cull value grown
 * by inflation — a conservative value for the extra cows still on the farm (negative when fewer).
 */
export function herdValueAtHorizon(cows: readonly number[], cullValue: number, inflation: number): number {
  const horizon = cows.length - 1;
  return ((cows[horizon] ?? 0) - (cows[0] ?? 0)) * cullValue * growthFactor(inflation, horizon);
}
