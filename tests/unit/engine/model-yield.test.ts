import { describe, expect, it } from 'vitest';
import { baseFeedCostPerYear, effectiveHousedDays, grazingDaysPerYear, marginalFeedCostPerYear } from '../../../shared/engine/feed';
import { growthFactor } from '../../../shared/engine/growth';
import { evaluateScenario } from '../../../shared/engine/evaluate';
import { extraCullsPer100Cows } from '../../../shared/engine/health';
import { cappedLyingHours, lactatingShare, milkSoldKgPerYear, rampFraction, stockedLyingHours, yieldPerCowDay } from '../../../shared/engine/yield';
import { handScenario } from './hand-scenario';

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
      lactatingShare: 1,
    });
    expect(y).toBeCloseTo(30, 12);
  });

  it('phases the lying-time response in at the year-1 fraction, not the system adjustment', () => {
    // docs/model.md: response may phase in over the first year (default 50 %).
    // 28 + 1.6 × 2 h × 0.5 + 0.5 = 30.1 in year 1; 28 + 3.2 + 0.5 = 31.7 from year 2.
    // g = 1.6 kg/h is the top of the Miner Institute range (0.9–1.6 kg, docs/references.md, read, secondary).
    const base = { baselineKgPerCowDay: 28, lyingResponseKgPerHour: 1.6, lyingHours: 14, currentLyingHours: 12, systemAdjustmentKgPerCowDay: 0.5, lactatingShare: 1 };
    expect(yieldPerCowDay({ ...base, rampFraction: rampFraction(1, 0.5) })).toBeCloseTo(30.1, 12);
    expect(yieldPerCowDay({ ...base, rampFraction: rampFraction(2, 0.5) })).toBeCloseTo(31.7, 12);
  });

  it('never gives negative milk', () => {
    // A cow cannot give less than 0 kg: 5 − 1 × 10 h = −5 → 0 (model convention).
    const y = yieldPerCowDay({ baselineKgPerCowDay: 5, lyingResponseKgPerHour: 1, lyingHours: 2, currentLyingHours: 12, systemAdjustmentKgPerCowDay: 0, rampFraction: 1, lactatingShare: 1 });
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

describe('cow comfort chain (docs: shared/engine/README.md, "Yield")', () => {
  it('counts the lying-time response on lactating days only', () => {
    // 60 dry days (a common-practice dry period, no source): 1 − 60/365 = 305/365 = 0.835616…
    expect(lactatingShare(60)).toBeCloseTo(305 / 365, 12);
    // Y 26, g 1.0, +1.5 h, full ramp: 26 + 1.5 × 305/365 = 27.253424… kg/cow/day (herd average).
    const y = yieldPerCowDay({ baselineKgPerCowDay: 26, lyingResponseKgPerHour: 1, lyingHours: 13.8, currentLyingHours: 12.3, systemAdjustmentKgPerCowDay: 0, rampFraction: 1, lactatingShare: lactatingShare(60) });
    expect(y).toBeCloseTo(26 + (1.5 * 305) / 365, 12);
  });

  it('takes lying time off for overstocked stalls and caps the lying time that earns milk', () => {
    // 1.2 cows per stall = 20 % over one per stall = 2 × 10 %; 0.3 h per 10 % → 13.8 − 0.6 = 13.2 h.
    expect(stockedLyingHours(13.8, 1.2, 0.3)).toBeCloseTo(13.2, 12);
    // At or below one cow per stall nothing is lost.
    expect(stockedLyingHours(13.8, 1, 0.3)).toBe(13.8);
    expect(stockedLyingHours(13.8, 0.9, 0.3)).toBe(13.8);
    // Cap 14 h (the top of the 12–14 h lying budget, Grant, dairy cattle extension, Table 1, read): 15 h earns as 14 h.
    expect(cappedLyingHours(15, 14)).toBe(14);
    expect(cappedLyingHours(13.2, 14)).toBe(13.2);
  });

  it('moves the barn option’s milk by the capped, stocked lying gain in the full evaluation', () => {
    // Hand case: current 12 h, candidate 13 h at 1.2 cows per stall (→ 12.4 h at 0.3 h per 10 %),
    // g 1.0 on every day: +0.4 kg/cow/day from year 2 → 100 × 30.4 × 365 = 1 109 600 kg.
    const scenario = handScenario((input) => {
      const candidate = input.options[1];
      if (candidate) candidate.stockingRate = 1.2;
      input.herd.lyingLossPer10PctOverstocking = 0.3;
    });
    const candidate = evaluateScenario(scenario).options.find((o) => o.id === 'candidate');
    expect(candidate?.years[2]?.yieldKgPerCowDay).toBeCloseTo(30.4, 12);
    expect(candidate?.years[2]?.milkSoldKg).toBeCloseTo(1_109_600, 6);
    // A cap of 12 h leaves the candidate no milk gain over the current 12 h: the break-even
    // lying response then has nothing to move.
    const capped = handScenario((input) => {
      input.herd.lyingResponseCapHours = 12;
    });
    const result = evaluateScenario(capped).options.find((o) => o.id === 'candidate');
    expect(result?.years[2]?.yieldKgPerCowDay).toBe(30);
    expect(result?.incremental?.breakEvenLyingResponseReason).toBe('same-lying-time');
  });

  it('adds the culls that follow lameness to the culling cost', () => {
    // 30 cases per 100 cows × 0.1 culls per case = 3 culls per 100 cows, plus 1 entered = 4;
    // 100 cows → 4 culls × (2 000 heifer − 800 cull value) = 4 800 a year with no growth.
    expect(extraCullsPer100Cows({ extraCullsPer100Cows: 1, lamenessCasesPer100Cows: 30, lamenessCullsPerCase: 0.1 })).toBeCloseTo(4, 12);
    const scenario = handScenario((input) => {
      const candidate = input.options[1];
      if (candidate) candidate.health = { ...candidate.health, extraCullsPer100Cows: 1, lamenessCasesPer100Cows: 30, lamenessCullsPerCase: 0.1 };
    });
    const candidate = evaluateScenario(scenario).options.find((o) => o.id === 'candidate');
    expect(candidate?.years[1]?.culling).toBe(4800);
  });
});
