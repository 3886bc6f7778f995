import { CM_PER_IN, L_PER_US_GAL } from '../units';

/** Stalls needed (count): ⌈cows ÷ stocking rate⌉, 0 without cows. */
export function stallsFor(cows: number, stockingRate: number): number {
  if (cows <= 0) return 0;
  // Guard against 100 / 1.0000000001 style float noise pushing an exact fit up by one stall.
  return Math.ceil(cows / stockingRate - 1e-9);
}

const inch = (value: number): number => (value * CM_PER_IN) / 100;

export interface Range {
  min: number;
  max: number;
}

export interface StallGuidance {
  /** Body weight class the row applies to (kg). */
  bodyWeightKg: Range;
  widthM: Range;
  lengthClosedFrontM: Range;
  lengthOpenFrontM: Range;
  neckRailHeightM: Range;
  neckRailFromCurbM: Range;
  brisketLocatorFromCurbM: Range;
  brisketLocatorHeightM: Range;
  source: string;
}

const GUIDANCE_SOURCE = 'Dairy cattle extension, "Design considerations for dairy cattle free stalls" (read), inches converted at 2.54 cm';

/** Freestall dimension guidance per breed size class, in metres converted from the published inches. */
export const STALL_GUIDANCE: Record<'small' | 'large', StallGuidance> = {
  small: {
    bodyWeightKg: { min: 590, max: 680 },
    widthM: { min: inch(45), max: inch(48) },
    lengthClosedFrontM: { min: inch(102), max: inch(108) },
    lengthOpenFrontM: { min: inch(90), max: inch(96) },
    neckRailHeightM: { min: inch(46), max: inch(48) },
    neckRailFromCurbM: { min: inch(66), max: inch(68) },
    brisketLocatorFromCurbM: { min: inch(68), max: inch(70) },
    brisketLocatorHeightM: { min: inch(4), max: inch(6) },
    source: GUIDANCE_SOURCE,
  },
  large: {
    bodyWeightKg: { min: 680, max: 770 },
    widthM: { min: inch(48), max: inch(52) },
    lengthClosedFrontM: { min: inch(108), max: inch(114) },
    lengthOpenFrontM: { min: inch(96), max: inch(102) },
    neckRailHeightM: { min: inch(48), max: inch(52) },
    neckRailFromCurbM: { min: inch(68), max: inch(70) },
    brisketLocatorFromCurbM: { min: inch(70), max: inch(72) },
    brisketLocatorHeightM: { min: inch(4), max: inch(6) },
    source: GUIDANCE_SOURCE,
  },
};

export interface StallDimensionsInput {
  front?: 'closed' | 'open';
  widthM?: number | undefined;
  lengthM?: number | undefined;
  neckRailHeightM?: number | undefined;
  neckRailFromCurbM?: number | undefined;
  brisketLocatorFromCurbM?: number | undefined;
  brisketLocatorHeightM?: number | undefined;
}

export interface DimensionCheck {
  field: keyof Omit<StallDimensionsInput, 'front'>;
  valueM: number;
  min: number;
  max: number;
  status: 'within' | 'outside';
  reason: string | null;
}

export interface StallCheck {
  status: 'within' | 'outside' | 'not-given';
  breedSize: 'small' | 'large';
  checks: DimensionCheck[];
  reasons: string[];
  source: string;
}

// A millimetre of slack: dimensions typed in metres from rounded inches should not fail.
const DIMENSION_TOLERANCE_M = 0.0005;

const LABELS: Record<DimensionCheck['field'], string> = {
  widthM: 'Stall width',
  lengthM: 'Stall length',
  neckRailHeightM: 'Neck rail height',
  neckRailFromCurbM: 'Neck rail distance from curb',
  brisketLocatorFromCurbM: 'Brisket locator distance from curb',
  brisketLocatorHeightM: 'Brisket locator height',
};

const cm = (m: number): string => `${(m * 100).toFixed(1)} cm`;

/**
 * Checks stall dimensions (m) against the guidance for the breed size class: each given
 * dimension is 'within' or 'outside' its range (±0.5 mm), with a reason naming the field.
 */
export function checkStallDimensions(dimensions: StallDimensionsInput | undefined, breedSize: 'small' | 'large'): StallCheck {
  const guidance = STALL_GUIDANCE[breedSize];
  if (!dimensions) return { status: 'not-given', breedSize, checks: [], reasons: [], source: guidance.source };
  const front = dimensions.front ?? 'closed';
  const ranges: Record<DimensionCheck['field'], Range> = {
    widthM: guidance.widthM,
    lengthM: front === 'closed' ? guidance.lengthClosedFrontM : guidance.lengthOpenFrontM,
    neckRailHeightM: guidance.neckRailHeightM,
    neckRailFromCurbM: guidance.neckRailFromCurbM,
    brisketLocatorFromCurbM: guidance.brisketLocatorFromCurbM,
    brisketLocatorHeightM: guidance.brisketLocatorHeightM,
  };
  const checks: DimensionCheck[] = [];
  for (const field of Object.keys(ranges) as DimensionCheck['field'][]) {
    const value = dimensions[field];
    if (value === undefined) continue;
    const range = ranges[field];
    const within = value >= range.min - DIMENSION_TOLERANCE_M && value <= range.max + DIMENSION_TOLERANCE_M;
    const label = field === 'lengthM' ? `${LABELS[field]} (${front} front)` : LABELS[field];
    checks.push({
      field,
      valueM: value,
      min: range.min,
      max: range.max,
      status: within ? 'within' : 'outside',
      reason: within
        ? null
        : `${label} ${cm(value)} is ${value < range.min ? 'below' : 'above'} the ${cm(range.min)}–${cm(range.max)} guidance for ${breedSize} cows (${guidance.bodyWeightKg.min}–${guidance.bodyWeightKg.max} kg)`,
    });
  }
  const reasons = checks.flatMap((check) => (check.reason ? [check.reason] : []));
  const status = checks.length === 0 ? 'not-given' : reasons.length === 0 ? 'within' : 'outside';
  return { status, breedSize, checks, reasons, source: guidance.source };
}

/** Minimum drinking perimeter per cow (m): 3 in, given as 7.6 cm (Penn State Extension, watering system design). */
export const MIN_TROUGH_PERIMETER_PER_COW_M = 0.076;
/** Minimum refill per trough (L/min): 10 US gal/min (Penn State Extension). */
export const MIN_FILL_RATE_L_PER_MIN = 10 * L_PER_US_GAL;
/** Minimum waterers per group (Penn State Extension). */
export const MIN_WATERERS_PER_GROUP = 2;

export interface WaterCheck {
  status: 'within' | 'outside';
  perimeterPerCowM: number | null;
  requiredPerimeterM: number;
  fillRateLitresPerMinute: number;
  reasons: string[];
}

/**
 * Checks water provision for a group: trough perimeter per cow (m) ≥ 7.6 cm, fill rate per
 * trough ≥ 10 US gal/min, and at least two waterers. Reasons name the failing measure.
 */
export function checkWater(cows: number, troughs: number, perimeterPerTroughM: number, fillRateLitresPerMinute: number): WaterCheck {
  const requiredPerimeterM = cows * MIN_TROUGH_PERIMETER_PER_COW_M;
  const perimeter = troughs * perimeterPerTroughM;
  const perimeterPerCowM = cows > 0 ? perimeter / cows : null;
  const reasons: string[] = [];
  if (cows > 0 && perimeter < requiredPerimeterM - 1e-9) {
    reasons.push(
      `Trough perimeter ${perimeter.toFixed(2)} m is below the ${requiredPerimeterM.toFixed(2)} m needed for ${cows} cows (7.6 cm per cow)`,
    );
  }
  if (troughs > 0 && fillRateLitresPerMinute < MIN_FILL_RATE_L_PER_MIN - 1e-9) {
    reasons.push(
      `Trough fill rate ${fillRateLitresPerMinute.toFixed(1)} L/min is below ${MIN_FILL_RATE_L_PER_MIN.toFixed(1)} L/min (10 US gal/min)`,
    );
  }
  if (cows > 0 && troughs < MIN_WATERERS_PER_GROUP) {
    reasons.push(`Water troughs: ${troughs} given, at least ${MIN_WATERERS_PER_GROUP} per group`);
  }
  return { status: reasons.length === 0 ? 'within' : 'outside', perimeterPerCowM, requiredPerimeterM, fillRateLitresPerMinute, reasons };
}

export interface StorageSizingInputs {
  /** Collected manure volume (m³/day) = collected kg/day ÷ density. */
  manureM3PerDay: number;
  /** Parlour wash water for the herd (m³/day). */
  washWaterM3PerDay: number;
  /** Bedding that ends up in storage (m³/day). */
  beddingM3PerDay: number;
  /** Net rain on the open storage (m/yr) and its surface (m²). */
  netRainMPerYear: number;
  openStorageAreaM2: number;
  storageDays: number;
  freeboardM: number;
}

/**
 * Manure storage volume (m³): (manure + wash water + bedding + net rain on the open area, per
 * day) × storage days, plus freeboard depth × open area.
 */
export function manureStorageVolumeM3(inputs: StorageSizingInputs): number {
  const rainM3PerDay = (inputs.netRainMPerYear * inputs.openStorageAreaM2) / 365;
  const daily = inputs.manureM3PerDay + inputs.washWaterM3PerDay + inputs.beddingM3PerDay + rainM3PerDay;
  return daily * inputs.storageDays + inputs.freeboardM * inputs.openStorageAreaM2;
}
