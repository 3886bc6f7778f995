/** Days of milk sold per year: Y already averages dry periods, so every day of the year counts. */
export const MILK_DAYS_PER_YEAR = 365;

export interface YieldInputs {
  /** Baseline yield Y (kg milk per cow per day, averaged over the year). */
  baselineKgPerCowDay: number;
  /** Milk response g to lying time (kg per cow per day per extra hour). */
  lyingResponseKgPerHour: number;
  /** Expected lying time of this option L_o (h/day). */
  lyingHours: number;
  /** Expected lying time of the current option L_current (h/day). */
  currentLyingHours: number;
  /** System yield adjustment a_o (kg per cow per day). */
  systemAdjustmentKgPerCowDay: number;
  /** Share of the lying-time response reached this year (1 after year 1). */
  rampFraction: number;
  /** Share of the cow-year the cows are lactating (fraction): the response is a lactating cow's. */
  lactatingShare: number;
}

/**
 * Yield per cow-day (kg/cow/day): Y + g·(L_o − L_current)·lactating share·ramp + a_o, floored at
 * 0 because a cow cannot give negative milk. Y averages the dry period, so the response of a
 * milking cow counts on lactating days only. Only the lying-time response phases in.
 */
export function yieldPerCowDay(inputs: YieldInputs): number {
  const lyingEffect = inputs.lyingResponseKgPerHour * (inputs.lyingHours - inputs.currentLyingHours) * inputs.lactatingShare * inputs.rampFraction;
  return Math.max(0, inputs.baselineKgPerCowDay + lyingEffect + inputs.systemAdjustmentKgPerCowDay);
}

/** Ramp fraction (unitless) of the lying-time response in operating year `year` (1-based). */
export function rampFraction(year: number, year1Fraction: number): number {
  return year <= 1 ? year1Fraction : 1;
}

/** Milk sold per year (kg/yr): N · Y_o · 365. */
export function milkSoldKgPerYear(cows: number, yieldKgPerCowDay: number): number {
  return cows * yieldKgPerCowDay * MILK_DAYS_PER_YEAR;
}

/** Share of the cow-year a cow is lactating (fraction): 1 − dry days ÷ 365, at least 0. */
export function lactatingShare(dryDaysPerCowYear: number): number {
  return Math.max(0, 1 - dryDaysPerCowYear / MILK_DAYS_PER_YEAR);
}

/**
 * Lying time with the stalls overstocked (h/day): the expected lying time less `lossPer10Pct`
 * hours for each 10 % of cows above one per stall, floored at 0; unchanged at or below one cow
 * per stall.
 */
export function stockedLyingHours(lyingHours: number, stockingRate: number, lossPer10Pct: number): number {
  const overstocked = Math.max(0, stockingRate - 1);
  return Math.max(0, lyingHours - lossPer10Pct * (overstocked / 0.1));
}

/** Lying time that earns milk (h/day): lying time up to the cap; rest beyond it brings no more milk. */
export function cappedLyingHours(lyingHours: number, capHours: number): number {
  return Math.min(lyingHours, capHours);
}
