/**
 * What every cow carries whatever the housing: other variable costs, milking labour, the herd's
 * own replacement, and the lower milk of a cow in the year she joins. Each is linear in the cows
 * of the year, so an option that adds cows pays for them year by year.
 */

/**
 * Cows joining the herd in each year (head), index = year, [0] = 0: the rise in cows from the
 * year before (today's herd before year 1); a year with fewer cows adds none.
 */
export function newcomersByYear(cows: readonly number[]): number[] {
  const joined = new Array<number>(cows.length).fill(0);
  for (let t = 1; t < cows.length; t++) joined[t] = Math.max(0, (cows[t] ?? 0) - (cows[t - 1] ?? 0));
  return joined;
}

/**
 * Cows in milk at the herd's yield (cow equivalents), index = year: the cows of the year with each
 * newcomer counted at the first-lactation factor, N_t − (1 − f) × joined_t. f = 1 leaves N_t.
 */
export function milkCowEquivalents(cows: readonly number[], firstLactationFactor: number): number[] {
  const joined = newcomersByYear(cows);
  return cows.map((n, t) => n - (1 - firstLactationFactor) * (joined[t] ?? 0));
}

/** The herd's own replacement in today's money (currency/yr): rate × cows × (heifer cost − cull value). */
export function herdReplacementCostPerYear(replacementRate: number, cows: number, heiferCost: number, cullValue: number): number {
  return replacementRate * cows * (heiferCost - cullValue);
}

/** Milking and cow handling labour (h/yr): hours per cow-year × cows. */
export function milkingHoursPerYear(hoursPerCowYear: number, cows: number): number {
  return hoursPerCowYear * cows;
}

/** Other variable costs of the cows in today's money (currency/yr): cost per cow-year × cows. */
export function otherCowCostsPerYear(costPerCowYear: number, cows: number): number {
  return costPerCowYear * cows;
}
