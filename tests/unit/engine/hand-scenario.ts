import { scenarioSchema, type Scenario, type ScenarioInput } from '../../../shared/schema';

type OptionInput = ScenarioInput['options'][number];

/** A bare freestall option: no labour, bedding, health, energy or manure costs, so each test adds only what it checks. */
export function bareOption(id: string, current: boolean, changes: Partial<OptionInput> = {}): OptionInput {
  return {
    id,
    name: id,
    startingPoint: 'steel-freestall',
    current,
    kind: 'freestall',
    divider: 'steel',
    bed: 'mattress',
    manureRemoval: 'tractor-scraper',
    housedDaysPerYear: 365,
    lyingHoursPerDay: 12,
    systemYieldAdjustment: 0,
    stockingRate: 1,
    feedCostPerCowDay: { housed: 5, grazing: 2.5 },
    health: { lamenessCasesPer100Cows: 0, lamenessCostPerCase: 0, mastitisCasesPer100Cows: 0, mastitisCostPerCase: 0, injuriesPer100Cows: 0, injuryCostPerCase: 0, extraCullsPer100Cows: 0 },
    labour: { scrapingPassesPerDay: 0, minutesPerScrapingPass: 0, bedCleaningsPerDay: 0, secondsPerStallCleaning: 0, beddingTonnesPerHour: 1, troughCleaningsPerDay: 0, minutesPerTroughCleaning: 0, grazingHoursPerGrazingDay: 0 },
    water: { troughs: 2, troughPerimeterM: 4, fillRateLitresPerMinute: 40 },
    bedding: { material: 'none', kgPerStallDay: 0, pricePerTonne: 0, bulkDensityTonnesPerM3: 0.25, shareToManureStorage: 0 },
    maintenanceRate: 0,
    manure: { collectionEfficiency: 0.9, handlingCostPerM3: 0, sandExtraHandlingCostPerM3: 0, storageDays: 120, washWaterM3PerCowDay: 0, openStorageAreaM2: 0, netRainMPerYear: 0, freeboardM: 0 },
    ...changes,
  };
}

/**
 * The hand-calculated case: 100 cows, 30 kg at 0.40 with no growth; the candidate lies 1 h longer
 * (g = 1.0 on every day, half in year 1) and costs one 100 000 lump sum (life 20, not replaced), all borrowed at
 * 5 % over 5 annual payments; horizon 5, discount 6 %, no tax; fertiliser prices 0.
 */
export function handScenarioInput(): ScenarioInput {
  return {
    schemaVersion: 1,
    name: 'Hand calculation',
    horizonYears: 5,
    currency: 'EUR',
    locale: 'en-IE',
    herd: {
      cows: 100,
      breedSize: 'large',
      yieldKgPerCowDay: 30,
      milkPricePerKg: 0.4,
      growth: { milkPrice: 0, feed: 0, wages: 0, bedding: 0, fertiliser: 0, general: 0 },
      feedCostPerCowDay: { housed: 5, grazing: 2.5 },
      marginalFeedCostPerKgMilk: 0.15,
      wagePerHour: 15,
      fertiliserPrices: { nitrogenPerKg: 0, phosphatePerKg: 0, potashPerKg: 0 },
      replacementHeiferCost: 2000,
      cullCowValue: 800,
      existingCashForDebtServicePerYear: 50_000,
      existingDebtPaymentsPerYear: 20_000,
      // The hand figures count the lying-time response on every day of the year.
      dryDaysPerCowYear: 0,
    },
    options: [
      bareOption('current', true),
      bareOption('candidate', false, {
        lyingHoursPerDay: 13,
        capitalLines: [{ kind: 'item', id: 'barn', description: 'Barn', category: 'building-shell', unit: 'lump-sum', quantity: 1, unitCost: 100_000, lifeYears: 20, replaceAtEndOfLife: false }],
      }),
    ],
    finance: { interestRate: 0.05, termYears: 5, paymentsPerYear: 1, discountRate: 0.06, taxRate: 0 },
  };
}

/** The hand case parsed, with an optional change to the input first. */
export function handScenario(change: (input: ScenarioInput) => void = () => {}): Scenario {
  const input = handScenarioInput();
  change(input);
  return scenarioSchema.parse(input);
}
