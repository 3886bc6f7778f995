import { describe, expect, it } from 'vitest';
import { evaluateNpvOnly, evaluateScenario } from '../../../shared/engine/evaluate';
import { herdReplacementCostPerYear, milkCowEquivalents, newcomersByYear } from '../../../shared/engine/herd-costs';
import type { ScenarioInput } from '../../../shared/schema';
import { handScenario } from './hand-scenario';

/**
 * Herd costs of the hand case (tests/unit/engine/hand-scenario.ts: 100 cows, 30 kg at 0.40, feed
 * 5.00 a cow-day, marginal feed 0.15 a kg, wage 15, heifer 2000, cull 800, no growth, no tax):
 * other cow costs 150 a cow-year (a round figure for the arithmetic), milking 10 h a cow-year (a
 * round figure), 30 % replaced a year (common practice, no source: a quarter to a third of the
 * cows in many housed herds), first-lactation milk 80 % of the herd's (recalled from memory:
 * first-lactation cows commonly give three quarters to 85 % of a mature cow's yield).
 */
function withHerdCosts(input: ScenarioInput): void {
  input.herd.otherVariableCostPerCowYear = 150;
  input.herd.milkingHoursPerCowYear = 10;
  input.herd.replacementRate = 0.3;
  input.herd.firstLactationYieldFactor = 0.8;
}

/** The candidate of the hand case adds 20 cows from year 1 (bought at the heifer cost, 2000). */
function withTwentyAddedCows(input: ScenarioInput): void {
  const candidate = input.options[1];
  if (candidate) candidate.herdChange = { addedCows: 20 };
}

const npvAt6 = (flows: readonly number[]) => flows.reduce((sum, cf, t) => sum + cf / 1.06 ** t, 0);

describe('what every cow carries (docs/model.md "Herd costs and expansion")', () => {
  it('counts newcomers and their first-lactation milk year by year', () => {
    // 100 today, 120 in years 1-2, 130 in year 3, 110 in year 4: 20 join in year 1, 10 in year 3, none leave-adjusted.
    expect(newcomersByYear([100, 120, 120, 130, 110])).toEqual([0, 20, 0, 10, 0]);
    // At 80 %: 120 − 0.2 × 20 = 116 cow equivalents in year 1; 130 − 0.2 × 10 = 128 in year 3.
    const equivalents = milkCowEquivalents([100, 120, 120, 130, 110], 0.8);
    expect(equivalents[1]).toBeCloseTo(116, 12);
    expect(equivalents[3]).toBeCloseTo(128, 12);
    expect(equivalents[4]).toBe(110);
    // 30 % of 100 cows × (2000 − 800) = 36 000.
    expect(herdReplacementCostPerYear(0.3, 100, 2000, 800)).toBeCloseTo(36_000, 9);
  });

  it('charges other cow costs, milking labour and the herd replacement on each year of every option', () => {
    const current = evaluateScenario(handScenario(withHerdCosts)).options[0];
    const year = current?.years[3];
    // 100 cows × 150 = 15 000; 100 × 10 h = 1000 h × 15 = 15 000; 0.3 × 100 × 1200 = 36 000.
    expect(year?.otherCowCosts).toBe(15_000);
    expect(year?.labourMilking).toBe(15_000);
    expect(year?.labourHours.milking).toBe(1000);
    expect(year?.herdReplacement).toBe(36_000);
    // Margin: 438 000 milk − 182 500 feed − 66 000 = 189 500 (255 500 without them).
    expect(year?.operatingMargin).toBe(189_500);
  });

  it('changes nothing when the herd inputs are left at their defaults', () => {
    const plain = evaluateScenario(handScenario());
    const current = plain.options[0];
    expect(current?.years[1]?.operatingMargin).toBe(255_500);
    expect(current?.years[1]?.otherCowCosts).toBe(0);
    // No option changes the herd: no split.
    expect(plain.options[1]?.incremental?.split).toBeNull();
  });

  it('splits the change into housing with today’s herd and the expansion, by hand', () => {
    const results = evaluateScenario(handScenario((input) => {
      withHerdCosts(input);
      withTwentyAddedCows(input);
    }));
    const candidate = results.options[1];
    // Year 1: 120 cows, 116 in milk at 30.5 kg (30 + 1 h × 1.0 × 50 % ramp) × 365 = 1 291 370 kg × 0.40 = 516 548.
    expect(candidate?.years[1]?.milkSoldKg).toBeCloseTo(1_291_370, 6);
    expect(candidate?.years[1]?.milkIncome).toBe(516_548);
    // Feed: 120 × 1825 = 219 000 + (1 291 370 − 120 × 10 950 = −22 630 kg) × 0.15 = −3 394.50 → 215 605.50.
    expect(candidate?.years[1]?.feed).toBe(215_605.5);
    // Margin: 516 548 − 215 605.50 − 120 × (150 + 150 + 360) = 221 742.50; year 2: 543 120 − 225 570 − 79 200 = 238 350.
    expect(candidate?.years[1]?.operatingMargin).toBe(221_742.5);
    expect(candidate?.years[2]?.operatingMargin).toBe(238_350);
    // The change: −100 000 barn − 40 000 cows; +32 242.50; +48 850 × 3; +48 850 + 75 000 salvage + 16 000 herd value.
    expect(candidate?.incremental?.cashFlows).toEqual([-140_000, 32_242.5, 48_850, 48_850, 48_850, 139_850]);
    const split = candidate?.incremental?.split;
    // Housing, today's herd (100 cows in the barn as built): year 1 445 300 − 185 237.50 − 66 000 − 189 500 = 4 562.50;
    // later 452 600 − 187 975 − 66 000 − 189 500 = 9 125; year 5 + 75 000 salvage.
    expect(split?.housingTodaysHerd.cashFlows).toEqual([-100_000, 4_562.5, 9_125, 9_125, 9_125, 84_125]);
    // Expansion, the 20 added cows: year 1 16 × 30.5 × 365 = 178 120 kg × 0.40 = 71 248 − (36 500 − 40 880 × 0.15) − 13 200 = 27 680;
    // later 20 × 31 × 365 = 226 300 kg → 90 520 − (36 500 + 7 300 × 0.15) − 13 200 = 39 725; year 5 + 20 × 800 herd value.
    expect(split?.expansion.cashFlows).toEqual([-40_000, 27_680, 39_725, 39_725, 39_725, 55_725]);
    expect(split?.expansion.npv).toBeCloseTo(npvAt6([-40_000, 27_680, 39_725, 39_725, 39_725, 55_725]), 6);
    expect(split?.housingTodaysHerd.npv).toBeCloseTo(npvAt6([-100_000, 4_562.5, 9_125, 9_125, 9_125, 84_125]), 6);
    // The two parts add up to the change.
    expect((split?.housingTodaysHerd.npv ?? 0) + (split?.expansion.npv ?? 0)).toBeCloseTo(candidate?.incremental?.npv ?? NaN, 6);
  });

  it('keeps the fast path and the break-even milk price on the same herd model', () => {
    const scenario = handScenario((input) => {
      withHerdCosts(input);
      withTwentyAddedCows(input);
    });
    const full = evaluateScenario(scenario).options[1];
    const fast = evaluateNpvOnly(scenario)[1];
    expect(fast?.incrementalNpv).toBeCloseTo(full?.incremental?.npv ?? NaN, 6);
    const price = full?.incremental?.breakEvenMilkPrice;
    expect(price).not.toBeNull();
    // At the break-even price the full ledger's change is worth 0 within the cents of rounding.
    const atPrice = evaluateScenario({ ...scenario, herd: { ...scenario.herd, milkPricePerKg: price ?? 0 } }).options[1];
    expect(Math.abs(atPrice?.incremental?.npv ?? NaN)).toBeLessThan(0.05);
  });
});

describe('milk quality premium or penalty per option (docs/model.md "Milk sold")', () => {
  it('moves that option’s milk income by milk sold × the premium, and nothing else', () => {
    const plain = evaluateScenario(handScenario()).options[1];
    const penalised = evaluateScenario(handScenario((input) => {
      const candidate = input.options[1];
      // A 0.01 a kg deduction, e.g. a bulk-tank count over a processor's threshold (an invented figure for the arithmetic).
      if (candidate) candidate.milkQualityPricePerKg = -0.01;
    })).options[1];
    // Year 2: 100 × 31 × 365 = 1 131 500 kg; at 0.39 instead of 0.40: 441 285 instead of 452 600.
    expect(plain?.years[2]?.milkIncome).toBe(452_600);
    expect(penalised?.years[2]?.milkIncome).toBe(441_285);
    expect(penalised?.years[2]?.feed).toBe(plain?.years[2]?.feed);
    // The current option keeps the plain price.
    expect(penalised?.incremental?.cashFlows[2]).toBe((plain?.incremental?.cashFlows[2] ?? 0) - 11_315);
  });

  it('carries the penalty into the break-even milk price search', () => {
    const scenario = handScenario((input) => {
      const candidate = input.options[1];
      if (candidate) candidate.milkQualityPricePerKg = -0.01;
    });
    const price = evaluateScenario(scenario).options[1]?.incremental?.breakEvenMilkPrice ?? null;
    const plainPrice = evaluateScenario(handScenario()).options[1]?.incremental?.breakEvenMilkPrice ?? null;
    expect(price).not.toBeNull();
    // A penalty on the candidate's milk needs a higher price for the barn to pay.
    expect(price ?? 0).toBeGreaterThan(plainPrice ?? Infinity);
    const atPrice = evaluateScenario({ ...scenario, herd: { ...scenario.herd, milkPricePerKg: price ?? 0 } }).options[1];
    expect(Math.abs(atPrice?.incremental?.npv ?? NaN)).toBeLessThan(0.05);
  });
});
