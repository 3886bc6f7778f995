import { describe, expect, it } from 'vitest';
import { baseFeedCostPerYear, effectiveHousedDays, grazingDaysPerYear, marginalFeedCostPerYear } from '../../../shared/engine/feed';
import { growthFactor } from '../../../shared/engine/growth';
import { milkSoldKgPerYear, rampFraction, yieldPerCowDay } from '../../../shared/engine/yield';

describe('yield per cow-day (docs/model.md: Y_o = Y + g·(L_o − L_current) + a_o)', () => {
  it('adds the lying-time response and the system adjustment', () => {
    // Hand calculation: Y 28 kg, g 1.0 kg/h (docs/references.md default, common practice),
    // L_o 13.8 h vs L_current 12.3 h (Tucker & Weary 2004: topdressed vs bare mattress) → +1.5 h,
    // a_o +0.5 kg → 28 + 1.0 × 1.5 + 0.5 = 30.0 kg/cow/day.
    const y = yieldPerCowDay({
      baselineKgPerCowDay: 28,
      lyingResponseKgPerHour: 1,
      lyingHours: 13.8,
      currentLyingHours: 12.3,
      systemAdjustmentKgPerCowDay: 0.5,
      rampFraction: 1,
    });
    expect(y).toBeCloseTo(30, 12);
  });

  it('phases the lying-time response in at the year-1 fraction, not the system adjustment', () => {
    // docs/model.md: response may phase in over the first year (default 50 %).
    // 28 + 1.6 × 2 h × 0.5 + 0.5 = 30.1 in year 1; 28 + 3.2 + 0.5 = 31.7 from year 2.
    // g = 1.6 kg/h is the top of the Miner Institute range (0.9–1.6 kg, docs/references.md, read, secondary).
    const base = { baselineKgPerCowDay: 28, lyingResponseKgPerHour: 1.6, lyingHours: 14, currentLyingHours: 12, systemAdjustmentKgPerCowDay: 0.5 };
    expect(yieldPerCowDay({ ...base, rampFraction: rampFraction(1, 0.5) })).toBeCloseTo(30.1, 12);
    expect(yieldPerCowDay({ ...base, rampFraction: rampFraction(2, 0.5) })).toBeCloseTo(31.7, 12);
  });

  it('never gives negative milk', () => {
    // A cow cannot give less than 0 kg: 5 − 1 × 10 h = −5 → 0 (model convention).
    const y = yieldPerCowDay({ baselineKgPerCowDay: 5, lyingResponseKgPerHour: 1, lyingHours: 2, currentLyingHours: 12, systemAdjustmentKgPerCowDay: 0, rampFraction: 1 });
    expect(y).toBe(0);
  });

  it('sells N · Y_o · 365 kg a year', () => {
    // docs/model.md: milk sold = N · Y_o · 365 → 120 × 30 × 365 = 1 314 000 kg.
    expect(milkSoldKgPerYear(120, 30)).toBe(1_314_000);
  });
});

describe('feed (docs/model.md: N · 365 · feed per cow-day, housed and grazing differ, + marginal feed × extra milk)', () => {
  it('splits the year into housed and grazing days', () => {
    // 150 housed days → 215 grazing days; 120 cows × (150 × 5.20 + 215 × 2.60) = 120 × (780 + 559) = 160 680.
    expect(grazingDaysPerYear(150)).toBe(215);
    expect(baseFeedCostPerYear(120, 150, 5.2, 2.6)).toBeCloseTo(160_680, 6);
  });

  it('caps a 366-day housing period at one year', () => {
    // Model convention: housed + grazing days = 365, so 366 housed days counts as 365 and 0 grazing days.
    expect(effectiveHousedDays(366)).toBe(365);
    expect(grazingDaysPerYear(366)).toBe(0);
    expect(baseFeedCostPerYear(10, 366, 5, 99)).toBeCloseTo(10 * 365 * 5, 9);
  });

  it('charges the marginal feed cost on extra milk and credits it on lost milk', () => {
    // 120 cows × 2 kg × 365 = 87 600 kg extra × 0.18 = 15 768; the same loss saves 15 768.
    expect(marginalFeedCostPerYear(87_600, 0.18)).toBeCloseTo(15_768, 9);
    expect(marginalFeedCostPerYear(-87_600, 0.18)).toBeCloseTo(-15_768, 9);
  });
});

describe('growth of today’s prices (docs/model.md: inputs in today’s money, yearly growth per line)', () => {
  it('grows a price by (1 + g)^t so year 1 carries one year of growth', () => {
    // 0.42 per kg at 1 %/yr: year 1 = 0.4242, year 2 = 0.42 × 1.0201 = 0.428442.
    expect(0.42 * growthFactor(0.01, 1)).toBeCloseTo(0.4242, 12);
    expect(0.42 * growthFactor(0.01, 2)).toBeCloseTo(0.428442, 12);
    expect(growthFactor(0.05, 0)).toBe(1);
  });
});
