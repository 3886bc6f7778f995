/**
 * Growth factor (unitless) for a price entered in today's money (year 0) and grown at a
 * nominal yearly rate: (1 + rate)^year, so year-1 values carry one year of growth.
 */
export function growthFactor(rate: number, year: number): number {
  return (1 + rate) ** year;
}
