import { describe, expect, it } from 'vitest';
import { evaluateScenario } from '../../../shared/engine/evaluate';
import { organicNitrogenPerHa } from '../../../shared/engine/warnings';
import {
  collectedManurePerYear,
  creditedNutrients,
  creditedValue,
  cropNeedCap,
  fertiliserValue,
  K2O_TO_K,
  K_TO_K2O,
  manureHandlingCostPerYear,
  P2O5_TO_P,
  P_TO_P2O5,
  storedVolumeM3PerYear,
} from '../../../shared/engine/manure';
import { KG_PER_LB } from '../../../shared/units';
import { bareOption, handScenario } from './hand-scenario';

const ASABE_LACTATING = { massKgPerCowDay: 68, nitrogenKgPerCowDay: 0.45, phosphorusKgPerCowDay: 0.078, potassiumKgPerCowDay: 0.1 };

describe('nutrient conversions', () => {
  it('uses the Virginia Tech SPES-201NP factors', () => {
    // Virginia Tech SPES-201NP (read): P × 2.2910 = P2O5, P2O5 × 0.4365 = P; K × 1.2051 = K2O, K2O × 0.8301 = K.
    expect(P_TO_P2O5).toBe(2.291);
    expect(P2O5_TO_P).toBe(0.4365);
    expect(K_TO_K2O).toBe(1.2051);
    expect(K2O_TO_K).toBe(0.8301);
  });

  it('has factors that invert each other and match the oxide formulas', () => {
    // SPES-201NP pairs round-trip to 1 within their 4-digit rounding.
    expect(P_TO_P2O5 * P2O5_TO_P).toBeCloseTo(1, 3);
    expect(K_TO_K2O * K2O_TO_K).toBeCloseTo(1, 3);
    // Stoichiometry, atomic weights from memory (P 30.974, K 39.098, O 15.999):
    // P2O5/2P = 141.943/61.948 = 2.2913; K2O/2K = 94.195/78.196 = 1.2046.
    expect(Math.abs(P_TO_P2O5 - (2 * 30.974 + 5 * 15.999) / (2 * 30.974))).toBeLessThan(0.001);
    expect(Math.abs(K_TO_K2O - (2 * 39.098 + 15.999) / (2 * 39.098))).toBeLessThan(0.001);
  });
});

describe('manure collected and its fertiliser value', () => {
  it('keeps the ASABE daily excretion close to the 150 lb a day Weiss reports', () => {
    // Weiss (2007) (read): about 150 lb/day per lactating cow = 68.04 kg; ASABE D384.2 68 kg (from memory).
    expect(Math.abs(150 * KG_PER_LB - ASABE_LACTATING.massKgPerCowDay)).toBeLessThan(0.1);
  });

  it('collects excretion × cows × housed days × efficiency', () => {
    // 120 cows × 365 days × 0.95 = 41 610 cow-days; N 0.45 × 41 610 = 18 724.5 kg; P 0.078 × 41 610 = 3245.58 kg;
    // K 0.10 × 41 610 = 4161 kg; manure 68 × 41 610 = 2 829 480 kg (ASABE D384.2, from memory).
    const collected = collectedManurePerYear(ASABE_LACTATING, 120, 365, 0.95);
    expect(collected.nitrogenKg).toBeCloseTo(18_724.5, 6);
    expect(collected.phosphorusKg).toBeCloseTo(3245.58, 6);
    expect(collected.potassiumKg).toBeCloseTo(4161, 6);
    expect(collected.massKg).toBeCloseTo(2_829_480, 4);
  });

  it('values N at its availability and P, K as oxides', () => {
    // N 18 724.5 × 0.35 (Cornell CSS 412, read: 35 % of organic N in the year applied) × 1.10 = 7208.9325
    // P2O5 3245.58 × 2.2910 = 7435.62378 × 1.0 × 0.90 = 6692.061402
    // K2O 4161 × 1.2051 = 5014.4211 × 1.0 × 0.60 = 3008.65266
    // total 16 909.646562
    const value = fertiliserValue(
      { massKg: 0, nitrogenKg: 18_724.5, phosphorusKg: 3245.58, potassiumKg: 4161 },
      { nitrogen: 0.35, phosphate: 1, potash: 1 },
      { nitrogenPerKg: 1.1, phosphatePerKg: 0.9, potashPerKg: 0.6 },
    );
    expect(value).toBeCloseTo(16_909.646562, 6);
  });

  it('gives no value when nothing is collected (all days at grazing)', () => {
    const none = collectedManurePerYear(ASABE_LACTATING, 120, 0, 0.9);
    expect(fertiliserValue(none, { nitrogen: 0.35, phosphate: 1, potash: 1 }, { nitrogenPerKg: 1, phosphatePerKg: 1, potashPerKg: 1 })).toBe(0);
  });
});

describe('stored volume and handling cost', () => {
  it('adds manure, wash water, bedding and net rain', () => {
    // Manure 2 829 480 kg ÷ 1000 kg/m³ (docs/references.md, from memory) = 2829.48 m³
    // wash water 0.05 m³ × 120 cows × 365 days = 2190 m³ (common practice: wash water joins the store)
    // bedding 566.6625 m³; net rain 0.4 m × 1000 m² = 400 m³ → 5986.1425 m³.
    const m3 = storedVolumeM3PerYear({
      manureKgPerYear: 2_829_480,
      manureDensityKgPerM3: 1000,
      washWaterM3PerCowDay: 0.05,
      cows: 120,
      washWaterDays: 365,
      beddingM3PerYear: 566.6625,
      openStorageAreaM2: 1000,
      netRainMPerYear: 0.4,
    });
    expect(m3).toBeCloseTo(5986.1425, 6);
  });

  it('charges handling plus the sand extra per m³', () => {
    // 5986.1425 m³ × (2.50 + 1.50) = 23 944.57 (sand-laden manure costs more to handle: common practice, no source).
    expect(manureHandlingCostPerYear(5986.1425, 2.5, 1.5)).toBeCloseTo(23_944.57, 6);
  });
});

describe('manure treated alike in grazing and housed options (docs: shared/engine/README.md, "Manure")', () => {
  const none = { massKg: 0, nitrogenKg: 0, phosphorusKg: 0, potassiumKg: 0 };
  const availability = { nitrogen: 0.35, phosphate: 1, potash: 1 };

  it('loses the storage share of collected N, credits a share of pasture dung, and caps P2O5 and K2O at crop need', () => {
    // Collected 1 000 kg N, 100 kg P, 200 kg K; on pasture 500 kg N, 50 kg P, 100 kg K credited at 40 %
    // (collectedManurePerYear with the credit as the share) → 200 kg N, 20 kg P, 40 kg K.
    const collected = { massKg: 0, nitrogenKg: 1000, phosphorusKg: 100, potassiumKg: 200 };
    const pasture = { massKg: 0, nitrogenKg: 200, phosphorusKg: 20, potassiumKg: 40 };
    // N: (1 000 × (1 − 0.25) + 200) × 0.35 (Cornell CSS 412, year applied, read) = 950 × 0.35 = 332.5 kg.
    // P2O5: 120 × 2.291 (Virginia Tech SPES-201NP) = 274.92 kg; K2O: 240 × 1.2051 = 289.224 kg.
    const uncapped = creditedNutrients(collected, pasture, 0.25, availability, { phosphateKg: null, potashKg: null });
    expect(uncapped.nitrogenKg).toBeCloseTo(332.5, 9);
    expect(uncapped.phosphateKg).toBeCloseTo(274.92, 9);
    expect(uncapped.potashKg).toBeCloseTo(289.224, 9);
    // Crop need 20 kg P2O5 and 40 kg K2O per ha on 10 ha → caps 200 and 400 kg: P2O5 capped, K2O not.
    const capped = creditedNutrients(collected, pasture, 0.25, availability, { phosphateKg: cropNeedCap(20, 10), potashKg: cropNeedCap(40, 10) });
    expect(capped.phosphateKg).toBe(200);
    expect(capped.potashKg).toBeCloseTo(289.224, 9);
    // No hectares entered → no cap.
    expect(cropNeedCap(20, null)).toBeNull();
    // Value at 1.20 N, 1.00 P2O5, 0.75 K2O: 332.5 × 1.2 + 200 × 1 + 289.224 × 0.75 = 399 + 200 + 216.918 = 815.918.
    expect(creditedValue(capped, { nitrogenPerKg: 1.2, phosphatePerKg: 1, potashPerKg: 0.75 })).toBeCloseTo(815.918, 9);
    // Nothing on pasture, no loss: the old formula.
    expect(creditedNutrients(collected, none, 0, availability, { phosphateKg: null, potashKg: null }).nitrogenKg).toBeCloseTo(350, 9);
  });

  it('sends parlour wash water to the store on every milking day, grazing or housed, unless diverted', () => {
    // Hand case current option turned into grazing with 150 housed days; 0.05 m³ wash water per cow per day;
    // nothing else reaches the store but manure: 100 cows × 68 kg × 150 days × 0.9 = 918 000 kg ÷ 1000 = 918 m³;
    // wash water 0.05 × 100 × 365 = 1 825 m³ (not × 150 housed days) → 2 743 m³ × 2.00 handling = 5 486.00.
    const grazing = (diverted: boolean) =>
      handScenario((input) => {
        input.options[0] = bareOption('current', true, {
          kind: 'grazing',
          housedDaysPerYear: 150,
          manure: { collectionEfficiency: 0.9, handlingCostPerM3: 2, sandExtraHandlingCostPerM3: 0, storageDays: 120, washWaterM3PerCowDay: 0.05, washWaterDiverted: diverted, openStorageAreaM2: 0, netRainMPerYear: 0, freeboardM: 0 },
        });
      });
    const year1 = evaluateScenario(grazing(false)).options[0]?.years[1];
    expect(year1?.manure.storedM3).toBeCloseTo(2743, 9);
    expect(year1?.manureHandling).toBe(5486);
    // Diverted: only the 918 m³ of manure → 1 836.00.
    expect(evaluateScenario(grazing(true)).options[0]?.years[1]?.manureHandling).toBe(1836);
  });
});

describe('organic nitrogen per hectare against the farm’s own limit', () => {
  it('notes an option whose herd passes the limit, and none without land or limit', () => {
    // Hand case: 100 cows × 0.45 kg N a day (ASABE D384.2, from memory) × 365 = 16 425 kg N a year;
    // on 80 ha = 205.3 kg N/ha, above a limit of 170 kg/ha (a limit the farm enters; no source needed).
    const withLand = handScenario((input) => {
      input.herd.land = { hectares: 80, organicNitrogenLimitKgPerHa: 170 };
    });
    expect(organicNitrogenPerHa(withLand, withLand.options[0] as (typeof withLand.options)[number])).toBeCloseTo(16_425 / 80, 9);
    const warnings = evaluateScenario(withLand).warnings.filter((w) => w.code === 'organic-nitrogen-over-limit');
    expect(warnings.map((w) => w.optionId)).toEqual(['current', 'candidate']);
    expect(warnings[0]?.message).toMatch(/about 205 kg N per hectare/);
    // On 100 ha: 164.25 kg/ha, within the limit.
    const roomy = handScenario((input) => {
      input.herd.land = { hectares: 100, organicNitrogenLimitKgPerHa: 170 };
    });
    expect(evaluateScenario(roomy).warnings).toEqual([]);
    expect(evaluateScenario(handScenario()).warnings).toEqual([]);
  });
});
