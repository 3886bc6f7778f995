import type { EnergyLine } from '../schema';

/** Electricity cost of an option's named energy lines in today's money (currency/yr): Σ kWh per year × price per kWh. */
export function energyCostToday(lines: readonly EnergyLine[]): number {
  let total = 0;
  for (const line of lines) total += line.kwhPerYear * line.pricePerKwh;
  return total;
}
