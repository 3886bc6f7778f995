import type { Herd } from './schema';

/** Whether any cost per cow besides feed is entered: without one the added cows' part of the change is overstated. */
export function herdCostsEntered(herd: Pick<Herd, 'otherVariableCostPerCowYear' | 'milkingHoursPerCowYear' | 'replacementRate'>): boolean {
  return herd.otherVariableCostPerCowYear > 0 || herd.milkingHoursPerCowYear > 0 || herd.replacementRate > 0;
}
