/** kg P2O5 per kg P (Virginia Tech SPES-201NP). */
export const P_TO_P2O5 = 2.291;
/** kg P per kg P2O5 (Virginia Tech SPES-201NP). */
export const P2O5_TO_P = 0.4365;
/** kg K2O per kg K (Virginia Tech SPES-201NP). */
export const K_TO_K2O = 1.2051;
/** kg K per kg K2O (Virginia Tech SPES-201NP). */
export const K2O_TO_K = 0.8301;

export interface Excretion {
  massKgPerCowDay: number;
  nitrogenKgPerCowDay: number;
  phosphorusKgPerCowDay: number;
  potassiumKgPerCowDay: number;
}

/** Collected manure and nutrients per year, as elements N, P, K (kg/yr). */
export interface CollectedManure {
  massKg: number;
  nitrogenKg: number;
  phosphorusKg: number;
  potassiumKg: number;
}

/**
 * Manure and nutrients collected per year (kg/yr): excretion per cow-day × N × housed days ×
 * collection efficiency. Manure dropped on pasture on grazing days is not collected.
 */
export function collectedManurePerYear(excretion: Excretion, cows: number, housedDays: number, collectionEfficiency: number): CollectedManure {
  const cowDays = cows * housedDays * collectionEfficiency;
  return {
    massKg: excretion.massKgPerCowDay * cowDays,
    nitrogenKg: excretion.nitrogenKgPerCowDay * cowDays,
    phosphorusKg: excretion.phosphorusKgPerCowDay * cowDays,
    potassiumKg: excretion.potassiumKgPerCowDay * cowDays,
  };
}

export interface NutrientAvailability {
  nitrogen: number;
  phosphate: number;
  potash: number;
}

export interface FertiliserPrices {
  nitrogenPerKg: number;
  phosphatePerKg: number;
  potashPerKg: number;
}

/**
 * Fertiliser replacement value (currency/yr): N·avail_N·price_N + P·2.2910·avail_P·price_P2O5 +
 * K·1.2051·avail_K·price_K2O, nutrients as elements in kg, prices per kg of N, P2O5, K2O.
 */
export function fertiliserValue(nutrients: CollectedManure, availability: NutrientAvailability, prices: FertiliserPrices): number {
  return (
    nutrients.nitrogenKg * availability.nitrogen * prices.nitrogenPerKg +
    nutrients.phosphorusKg * P_TO_P2O5 * availability.phosphate * prices.phosphatePerKg +
    nutrients.potassiumKg * K_TO_K2O * availability.potash * prices.potashPerKg
  );
}

export interface StoredVolumeInputs {
  /** Collected manure (kg/yr). */
  manureKgPerYear: number;
  /** Density of the manure (kg/m³). */
  manureDensityKgPerM3: number;
  /** Parlour wash water (m³ per cow per day) on each milking day. */
  washWaterM3PerCowDay: number;
  cows: number;
  /** Days the parlour's wash water goes to the store: every milking day of the year, grazing or housed; 0 when diverted. */
  washWaterDays: number;
  /** Bedding volume reaching the storage (m³/yr). */
  beddingM3PerYear: number;
  /** Open storage surface (m²) and net rain on it (m/yr). */
  openStorageAreaM2: number;
  netRainMPerYear: number;
}

/**
 * Volume passing through the manure storage (m³/yr): manure ÷ density + wash water × N × wash
 * water days + bedding + net rain × open area. This is the volume agitated, hauled and spread.
 */
export function storedVolumeM3PerYear(inputs: StoredVolumeInputs): number {
  return (
    inputs.manureKgPerYear / inputs.manureDensityKgPerM3 +
    inputs.washWaterM3PerCowDay * inputs.cows * inputs.washWaterDays +
    inputs.beddingM3PerYear +
    inputs.netRainMPerYear * inputs.openStorageAreaM2
  );
}

/** Manure handling cost in today's money (currency/yr): m³ × (handling cost + sand extra handling) per m³. */
export function manureHandlingCostPerYear(volumeM3: number, handlingCostPerM3: number, sandExtraCostPerM3: number): number {
  return volumeM3 * (handlingCostPerM3 + sandExtraCostPerM3);
}

/** Nutrients that replace bought fertiliser in a year: N, P₂O₅ and K₂O (kg/yr). */
export interface CreditedNutrients {
  nitrogenKg: number;
  phosphateKg: number;
  potashKg: number;
}

/**
 * Nutrients credited as fertiliser saved (kg/yr): the collected N less the share lost in storage,
 * plus the credited share of what is dropped on pasture, times availability; P and K the same as
 * P₂O₅ (× 2.2910) and K₂O (× 1.2051). Credited P₂O₅ and K₂O never pass the crop's need × hectares
 * when both are known (null cap = no cap): beyond that the manure saves no fertiliser.
 */
export function creditedNutrients(
  collected: CollectedManure,
  onPasture: CollectedManure,
  storageNitrogenLoss: number,
  availability: NutrientAvailability,
  cap: { phosphateKg: number | null; potashKg: number | null },
): CreditedNutrients {
  const phosphateKg = (collected.phosphorusKg + onPasture.phosphorusKg) * P_TO_P2O5 * availability.phosphate;
  const potashKg = (collected.potassiumKg + onPasture.potassiumKg) * K_TO_K2O * availability.potash;
  return {
    nitrogenKg: (collected.nitrogenKg * (1 - storageNitrogenLoss) + onPasture.nitrogenKg) * availability.nitrogen,
    phosphateKg: cap.phosphateKg === null ? phosphateKg : Math.min(phosphateKg, cap.phosphateKg),
    potashKg: cap.potashKg === null ? potashKg : Math.min(potashKg, cap.potashKg),
  };
}

/** Fertiliser value of credited nutrients in today's money (currency/yr): kg of N, P₂O₅, K₂O × their prices. */
export function creditedValue(credited: CreditedNutrients, prices: FertiliserPrices): number {
  return credited.nitrogenKg * prices.nitrogenPerKg + credited.phosphateKg * prices.phosphatePerKg + credited.potashKg * prices.potashPerKg;
}

/** A crop-need cap (kg/yr): need per hectare × hectares, or null when either is not entered. */
export function cropNeedCap(needKgPerHa: number | null, hectares: number | null): number | null {
  return needKgPerHa === null || hectares === null ? null : needKgPerHa * hectares;
}

/** Scales a per-cow amount of manure and nutrients to a herd (kg/yr). */
export function scaleManure(perCow: CollectedManure, cows: number): CollectedManure {
  return { massKg: perCow.massKg * cows, nitrogenKg: perCow.nitrogenKg * cows, phosphorusKg: perCow.phosphorusKg * cows, potassiumKg: perCow.potassiumKg * cows };
}
