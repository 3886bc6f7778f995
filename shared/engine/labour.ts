/** Scraping hours per year (h/yr): passes per day × minutes per pass ÷ 60 × housed days. */
export function scrapingHoursPerYear(passesPerDay: number, minutesPerPass: number, housedDays: number): number {
  return ((passesPerDay * minutesPerPass) / 60) * housedDays;
}

/** Bed-care hours per year (h/yr): cleanings per day × seconds per stall × stalls ÷ 3600 × housed days. */
export function bedCareHoursPerYear(cleaningsPerDay: number, secondsPerStall: number, stalls: number, housedDays: number): number {
  return ((cleaningsPerDay * secondsPerStall * stalls) / 3600) * housedDays;
}

/** Bedding top-up hours per year (h/yr): bedding tonnes per year ÷ tonnes handled per hour; 0 with no bedding. */
export function beddingTopUpHoursPerYear(beddingTonnesPerYear: number, tonnesPerHour: number): number {
  if (beddingTonnesPerYear <= 0 || tonnesPerHour <= 0) return 0;
  return beddingTonnesPerYear / tonnesPerHour;
}

/** Water trough cleaning hours per year (h/yr): cleanings per day × minutes per trough × troughs ÷ 60 × housed days. */
export function troughHoursPerYear(cleaningsPerDay: number, minutesPerTrough: number, troughs: number, housedDays: number): number {
  return ((cleaningsPerDay * minutesPerTrough * troughs) / 60) * housedDays;
}

/** Grazing work hours per year (h/yr): hours per grazing day × grazing days. */
export function grazingHoursPerYear(hoursPerGrazingDay: number, grazingDays: number): number {
  return hoursPerGrazingDay * grazingDays;
}

/** Labour cost (currency/yr): hours × wage in today's money × wage growth factor for the year. */
export function labourCost(hours: number, wagePerHour: number, wageGrowthFactor: number): number {
  return hours * wagePerHour * wageGrowthFactor;
}
