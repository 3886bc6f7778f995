/**
 * Unit conversion between Byrecast's internal SI units and US customary display units.
 * Every factor below is an exact definition (NIST Handbook 44, Appendix C), so conversions
 * are a single multiplication or division by an exact decimal.
 */

/** kg in one avoirdupois pound (exact by definition). */
export const KG_PER_LB = 0.45359237;
/** m in one international foot (exact by definition). */
export const M_PER_FT = 0.3048;
/** cm in one inch (exact by definition). */
export const CM_PER_IN = 2.54;
/** m² in one square foot (0.3048², exact). */
export const M2_PER_FT2 = 0.09290304;
/** m³ in one cubic foot (0.3048³, exact). */
export const M3_PER_FT3 = 0.028316846592;
/** L in one US liquid gallon (231 in³, exact). */
export const L_PER_US_GAL = 3.785411784;
/** m³ in one US liquid gallon. */
export const M3_PER_US_GAL = 0.003785411784;
/** lb in one short hundredweight (cwt). */
export const LB_PER_CWT = 100;
/** kg in one short hundredweight (100 lb). */
export const KG_PER_CWT = 45.359237;
/** lb in one US (short) ton. */
export const LB_PER_US_TON = 2000;
/** kg in one US (short) ton (2000 lb). */
export const KG_PER_US_TON = 907.18474;
/** kg in one tonne. */
export const KG_PER_TONNE = 1000;

/** kg → lb. */
export const kgToLb = (kg: number): number => kg / KG_PER_LB;
/** lb → kg. */
export const lbToKg = (lb: number): number => lb * KG_PER_LB;
/** m → ft. */
export const mToFt = (m: number): number => m / M_PER_FT;
/** ft → m. */
export const ftToM = (ft: number): number => ft * M_PER_FT;
/** cm → in. */
export const cmToIn = (cm: number): number => cm / CM_PER_IN;
/** in → cm. */
export const inToCm = (inches: number): number => inches * CM_PER_IN;
/** m² → ft². */
export const m2ToFt2 = (m2: number): number => m2 / M2_PER_FT2;
/** ft² → m². */
export const ft2ToM2 = (ft2: number): number => ft2 * M2_PER_FT2;
/** m³ → ft³. */
export const m3ToFt3 = (m3: number): number => m3 / M3_PER_FT3;
/** ft³ → m³. */
export const ft3ToM3 = (ft3: number): number => ft3 * M3_PER_FT3;
/** m³ → US gal. */
export const m3ToUsGal = (m3: number): number => m3 / M3_PER_US_GAL;
/** US gal → m³. */
export const usGalToM3 = (gal: number): number => gal * M3_PER_US_GAL;
/** L → US gal. */
export const litreToUsGal = (litres: number): number => litres / L_PER_US_GAL;
/** US gal → L. */
export const usGalToLitre = (gal: number): number => gal * L_PER_US_GAL;
/** Price per kg → price per cwt (100 lb); same currency. */
export const perKgToPerCwt = (perKg: number): number => perKg * KG_PER_CWT;
/** Price per cwt (100 lb) → price per kg; same currency. */
export const perCwtToPerKg = (perCwt: number): number => perCwt / KG_PER_CWT;
/** Price per tonne → price per US ton (2000 lb); same currency. */
export const perTonneToPerUsTon = (perTonne: number): number => (perTonne * KG_PER_US_TON) / KG_PER_TONNE;
/** Price per US ton (2000 lb) → price per tonne; same currency. */
export const perUsTonToPerTonne = (perUsTon: number): number => (perUsTon * KG_PER_TONNE) / KG_PER_US_TON;

/** The two unit systems a farm can display in; storage is always metric (SI). */
export type UnitSystem = 'metric' | 'us';

/**
 * Kinds of quantity the UI shows. Internal unit first, US display unit second:
 * mass kg|lb, massPerDay kg/day|lb/day, yield kg/cow/day|lb/cow/day, tonnage t|US ton,
 * length m|ft, shortLength cm|in, area m²|ft², volume m³|ft³, storageVolume m³|US gal,
 * liquidVolume L|US gal, flowRate L/min|US gal/min, milkPrice per kg|per cwt,
 * pricePerKg per kg|per lb, pricePerTonne per t|per US ton, pricePerArea per m²|per ft²,
 * pricePerVolume per m³|per ft³.
 */
export type Quantity =
  | 'mass'
  | 'massPerDay'
  | 'yield'
  | 'tonnage'
  | 'length'
  | 'shortLength'
  | 'area'
  | 'volume'
  | 'storageVolume'
  | 'liquidVolume'
  | 'flowRate'
  | 'milkPrice'
  | 'pricePerKg'
  | 'pricePerTonne'
  | 'pricePerArea'
  | 'pricePerVolume';

interface Conversion {
  /** Internal units in one US display unit of an amount; for a price, the amount it is "per". */
  readonly siPerUs: number;
  /** A price is per unit of amount, so it converts the other way round. */
  readonly isPrice: boolean;
  readonly metricLabel: string;
  readonly usLabel: string;
}

const CONVERSIONS: Readonly<Record<Quantity, Conversion>> = {
  mass: { siPerUs: KG_PER_LB, isPrice: false, metricLabel: 'kg', usLabel: 'lb' },
  massPerDay: { siPerUs: KG_PER_LB, isPrice: false, metricLabel: 'kg/day', usLabel: 'lb/day' },
  yield: { siPerUs: KG_PER_LB, isPrice: false, metricLabel: 'kg/cow/day', usLabel: 'lb/cow/day' },
  tonnage: { siPerUs: KG_PER_US_TON / KG_PER_TONNE, isPrice: false, metricLabel: 't', usLabel: 'US ton' },
  length: { siPerUs: M_PER_FT, isPrice: false, metricLabel: 'm', usLabel: 'ft' },
  shortLength: { siPerUs: CM_PER_IN, isPrice: false, metricLabel: 'cm', usLabel: 'in' },
  area: { siPerUs: M2_PER_FT2, isPrice: false, metricLabel: 'm²', usLabel: 'ft²' },
  volume: { siPerUs: M3_PER_FT3, isPrice: false, metricLabel: 'm³', usLabel: 'ft³' },
  storageVolume: { siPerUs: M3_PER_US_GAL, isPrice: false, metricLabel: 'm³', usLabel: 'US gal' },
  liquidVolume: { siPerUs: L_PER_US_GAL, isPrice: false, metricLabel: 'L', usLabel: 'US gal' },
  flowRate: { siPerUs: L_PER_US_GAL, isPrice: false, metricLabel: 'L/min', usLabel: 'US gal/min' },
  milkPrice: { siPerUs: KG_PER_CWT, isPrice: true, metricLabel: 'per kg', usLabel: 'per cwt' },
  pricePerKg: { siPerUs: KG_PER_LB, isPrice: true, metricLabel: 'per kg', usLabel: 'per lb' },
  pricePerTonne: { siPerUs: KG_PER_US_TON / KG_PER_TONNE, isPrice: true, metricLabel: 'per t', usLabel: 'per US ton' },
  pricePerArea: { siPerUs: M2_PER_FT2, isPrice: true, metricLabel: 'per m²', usLabel: 'per ft²' },
  pricePerVolume: { siPerUs: M3_PER_FT3, isPrice: true, metricLabel: 'per m³', usLabel: 'per ft³' },
};

/** Every quantity kind, for iteration in forms and tests. */
export const QUANTITIES = Object.keys(CONVERSIONS) as readonly Quantity[];

/** Rounds to `decimals` places via the decimal string of the double (toFixed), so the result is the double nearest that decimal. */
function roundToDecimals(value: number, decimals: number): number {
  return Number(value.toFixed(Math.min(100, Math.max(0, Math.trunc(decimals)))));
}

/** Converts an internal (SI) value to the display unit of `units`; metric is the identity. */
export function toDisplay(value: number, quantity: Quantity, units: UnitSystem): number {
  if (units === 'metric') return value;
  const { siPerUs, isPrice } = CONVERSIONS[quantity];
  return isPrice ? value * siPerUs : value / siPerUs;
}

/**
 * Converts a displayed value back to the internal (SI) unit. With `decimals`, the SI result is
 * rounded to that stored precision, so `fromDisplay(toDisplay(x)) === x` for any x stored to
 * that many decimals (a bare float round trip can be off by one ulp).
 */
export function fromDisplay(value: number, quantity: Quantity, units: UnitSystem, decimals?: number): number {
  const { siPerUs, isPrice } = CONVERSIONS[quantity];
  const si = units === 'metric' ? value : isPrice ? value / siPerUs : value * siPerUs;
  return decimals === undefined ? si : roundToDecimals(si, decimals);
}

/** Unit label for a quantity in a unit system, e.g. unitLabel('milkPrice', 'us') → 'per cwt'. */
export function unitLabel(quantity: Quantity, units: UnitSystem): string {
  const conversion = CONVERSIONS[quantity];
  return units === 'metric' ? conversion.metricLabel : conversion.usLabel;
}
