// Less than half a cent due is nothing due: ledger amounts are whole cents.
const NOTHING_DUE = 0.005;

/**
 * Debt-service coverage (ratio): cash available for debt service ÷ scheduled principal +
 * interest; null when nothing is due (a ratio over zero debt service is undefined).
 */
export function coverageRatio(cashAvailable: number, debtService: number): number | null {
  return somethingDue(debtService) ? cashAvailable / debtService : null;
}

/** True when a debt service (currency) is something to cover: the ratio over it is defined. */
export function somethingDue(debtService: number): boolean {
  return debtService >= NOTHING_DUE;
}

/**
 * Ratios closer than this count as equal: two years with the same cash and debt service differ
 * only by floating-point noise (~1e-15), and a spreadsheet recalculating them must find the same year.
 */
export const COVERAGE_TIE = 1e-9;

/**
 * Lowest defined value and its year; null when no year has a value. Ties (within COVERAGE_TIE of
 * the lowest) go to the earliest year; the workbook's "In year" formula uses the same rule.
 */
export function lowestByYear(values: readonly { year: number; value: number | null }[]): { year: number; value: number } | null {
  let lowest: number | null = null;
  for (const { value } of values) if (value !== null && (lowest === null || value < lowest)) lowest = value;
  if (lowest === null) return null;
  const first = values.find(({ value }) => value !== null && value <= lowest + COVERAGE_TIE);
  return first ? { year: first.year, value: lowest } : null;
}
