/** Bedding used per year (t/yr): kg per stall per day × stalls × housed days ÷ 1000. */
export function beddingTonnesPerYear(kgPerStallDay: number, stalls: number, housedDays: number): number {
  return (kgPerStallDay * stalls * housedDays) / 1000;
}

/** Bedding cost in today's money (currency/yr): tonnes per year × price per tonne. */
export function beddingCostPerYear(tonnesPerYear: number, pricePerTonne: number): number {
  return tonnesPerYear * pricePerTonne;
}

/** Bedding volume reaching the manure storage (m³/yr): tonnes × share to storage ÷ bulk density (t/m³). */
export function beddingToStorageM3PerYear(tonnesPerYear: number, shareToStorage: number, bulkDensityTonnesPerM3: number): number {
  if (bulkDensityTonnesPerM3 <= 0) return 0;
  return (tonnesPerYear * shareToStorage) / bulkDensityTonnesPerM3;
}
