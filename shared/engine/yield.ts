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
}

/**
 * Yield per cow-day (kg/cow/day): Y + g·(L_o − L_current)·ramp + a_o, floored at 0 because a
 * cow cannot give negative milk. Only the lying-time response phases in.
 */
export function yieldPerCowDay(inputs: YieldInputs): number {
  const lyingEffect = inputs.lyingResponseKgPerHour * (inputs.lyingHours - inputs.currentLyingHours) * inputs.rampFraction;
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
