import { describe, expect, it } from 'vitest';
import {
  collectedManurePerYear,
  fertiliserValue,
  K2O_TO_K,
  K_TO_K2O,
  manureHandlingCostPerYear,
  P2O5_TO_P,
  P_TO_P2O5,
  storedVolumeM3PerYear,
} from '../../../shared/engine/manure';
import { KG_PER_LB } from '../../../shared/units';

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
      housedDays: 365,
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
