// Less than half a cent due is nothing due: ledger amounts are whole cents.
const NOTHING_DUE = 0.005;

/**
 * Debt-service coverage (ratio): cash available for debt service ÷ scheduled principal +
 * interest; null when nothing is due (a ratio over zero debt service is undefined).
 */
export function coverageRatio(cashAvailable: number, debtService: number): number | null {
  if (!(debtService >= NOTHING_DUE)) return null;
  return cashAvailable / debtService;
}

/** Lowest defined value and its year; null when no year has a value. */
export function lowestByYear(values: readonly { year: number; value: number | null }[]): { year: number; value: number } | null {
  let lowest: { year: number; value: number } | null = null;
  for (const { year, value } of values) {
    if (value === null) continue;
    if (lowest === null || value < lowest.value) lowest = { year, value };
  }
  return lowest;
}
