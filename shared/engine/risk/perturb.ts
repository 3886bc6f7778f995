import type { CapitalLine, Option, RiskInputKey, Scenario } from '../../schema';

/** A multiplier per key input; 1 (or absent) leaves the input as entered. */
export type Multipliers = Partial<Record<RiskInputKey, number>>;

/** Milk price per kg × m (herd baseline price; every option sells at it). */
export function scaleMilkPrice(scenario: Scenario, m: number): Scenario {
  return { ...scenario, herd: { ...scenario.herd, milkPricePerKg: scenario.herd.milkPricePerKg * m } };
}

/** Lying-time milk response g (kg/cow/day per hour) × m. */
export function scaleYieldResponse(scenario: Scenario, m: number): Scenario {
  return { ...scenario, herd: { ...scenario.herd, lyingResponseKgPerHour: scenario.herd.lyingResponseKgPerHour * m } };
}

/** Wage per hour × m. */
export function scaleWage(scenario: Scenario, m: number): Scenario {
  return { ...scenario, herd: { ...scenario.herd, wagePerHour: scenario.herd.wagePerHour * m } };
}

/** Fertiliser prices per kg of N, P₂O₅ and K₂O, all × m (they move together with the fertiliser market). */
export function scaleFertiliserPrices(scenario: Scenario, m: number): Scenario {
  const prices = scenario.herd.fertiliserPrices;
  return {
    ...scenario,
    herd: {
      ...scenario.herd,
      fertiliserPrices: {
        nitrogenPerKg: prices.nitrogenPerKg * m,
        phosphatePerKg: prices.phosphatePerKg * m,
        potashPerKg: prices.potashPerKg * m,
      },
    },
  };
}

/** Loan interest rate (fraction per year) × m; the discount rate is left alone. */
export function scaleInterestRate(scenario: Scenario, m: number): Scenario {
  return { ...scenario, finance: { ...scenario.finance, interestRate: scenario.finance.interestRate * m } };
}

const mapOptions = (scenario: Scenario, change: (option: Option) => Option): Scenario => ({
  ...scenario,
  options: scenario.options.map(change),
});

/**
 * Unit cost of every capital item in every option × m. A contingency line is a share of the
 * other lines, so it follows them without being touched.
 */
export function scaleCapitalCost(scenario: Scenario, m: number): Scenario {
  const scaleLine = (line: CapitalLine): CapitalLine => (line.kind === 'item' ? { ...line, unitCost: line.unitCost * m } : line);
  return mapOptions(scenario, (option) => ({ ...option, capitalLines: option.capitalLines.map(scaleLine) }));
}

/** Bedding price per tonne in every option × m. */
export function scaleBeddingPrice(scenario: Scenario, m: number): Scenario {
  return mapOptions(scenario, (option) => ({
    ...option,
    bedding: { ...option.bedding, pricePerTonne: option.bedding.pricePerTonne * m },
  }));
}

/**
 * Herd size × m: the baseline cows and, so every option keeps its herd relative to the
 * baseline, each option's cows per year and added cows. Cow counts are left fractional (they
 * are lactating-cow equivalents) so NPV moves smoothly with m.
 */
export function scaleHerdSize(scenario: Scenario, m: number): Scenario {
  const scaled = mapOptions(scenario, (option) => ({
    ...option,
    herdChange: {
      ...option.herdChange,
      cowsByYear: option.herdChange.cowsByYear?.map((cows) => cows * m) ?? null,
      addedCows: option.herdChange.addedCows * m,
    },
  }));
  return { ...scaled, herd: { ...scaled.herd, cows: scenario.herd.cows * m } };
}

/** Housed feed cost per cow-day in every option × m (and the herd baseline new options copy). */
export function scaleHousedFeedCost(scenario: Scenario, m: number): Scenario {
  const scaled = mapOptions(scenario, (option) => ({ ...option, feedCostPerCowDay: { ...option.feedCostPerCowDay, housed: option.feedCostPerCowDay.housed * m } }));
  return { ...scaled, herd: { ...scaled.herd, feedCostPerCowDay: { ...scaled.herd.feedCostPerCowDay, housed: scenario.herd.feedCostPerCowDay.housed * m } } };
}

/** Grazing feed cost per cow-day in every option × m (and the herd baseline). */
export function scaleGrazingFeedCost(scenario: Scenario, m: number): Scenario {
  const scaled = mapOptions(scenario, (option) => ({ ...option, feedCostPerCowDay: { ...option.feedCostPerCowDay, grazing: option.feedCostPerCowDay.grazing * m } }));
  return { ...scaled, herd: { ...scaled.herd, feedCostPerCowDay: { ...scaled.herd.feedCostPerCowDay, grazing: scenario.herd.feedCostPerCowDay.grazing * m } } };
}

/** Marginal feed cost per extra kg of milk × m. */
export function scaleMarginalFeedCost(scenario: Scenario, m: number): Scenario {
  return { ...scenario, herd: { ...scenario.herd, marginalFeedCostPerKgMilk: scenario.herd.marginalFeedCostPerKgMilk * m } };
}

/** Each option's system yield adjustment (kg/cow/day beyond the lying-time effect) × m: how far the barn's feeding gain holds. */
export function scaleSystemYield(scenario: Scenario, m: number): Scenario {
  return mapOptions(scenario, (option) => ({ ...option, systemYieldAdjustment: option.systemYieldAdjustment * m }));
}

/** Cost per case of lameness, mastitis and injuries in every option × m. */
export function scaleHealthCostPerCase(scenario: Scenario, m: number): Scenario {
  return mapOptions(scenario, (option) => ({
    ...option,
    health: {
      ...option.health,
      lamenessCostPerCase: option.health.lamenessCostPerCase * m,
      mastitisCostPerCase: option.health.mastitisCostPerCase * m,
      injuryCostPerCase: option.health.injuryCostPerCase * m,
    },
  }));
}

/** Manure (slurry) handling cost per m³, the sand extra included, in every option × m. */
export function scaleManureHandlingCost(scenario: Scenario, m: number): Scenario {
  return mapOptions(scenario, (option) => ({
    ...option,
    manure: { ...option.manure, handlingCostPerM3: option.manure.handlingCostPerM3 * m, sandExtraHandlingCostPerM3: option.manure.sandExtraHandlingCostPerM3 * m },
  }));
}

/**
 * Percentage points a year of milk growth per unit of multiplier: the milk-minus-feed growth gap
 * is a difference of rates and can be 0, so its "multiplier" shifts milk growth instead of
 * scaling it — 1.2 has milk grow 1 point a year faster than entered, 0.8 one point slower.
 */
export const GROWTH_GAP_POINTS_PER_UNIT = 0.05;

/** Milk price growth shifted by (m − 1) × 5 points a year against feed (feed growth as entered). */
export function shiftMilkFeedGrowthGap(scenario: Scenario, m: number): Scenario {
  const growth = scenario.herd.growth;
  const milk = (growth.milkPrice ?? growth.general) + (m - 1) * GROWTH_GAP_POINTS_PER_UNIT;
  return { ...scenario, herd: { ...scenario.herd, growth: { ...growth, milkPrice: milk } } };
}

/**
 * Each candidate's lying-time gain over the current option × m (its lying hours become current +
 * gain × m, kept within 0–24 h); the current option is left alone, so the uncertainty is in the
 * gain the new housing brings, not in the herd's present rest.
 */
export function scaleLyingGain(scenario: Scenario, m: number): Scenario {
  const current = scenario.options.find((option) => option.current) ?? scenario.options[0];
  const base = current?.lyingHoursPerDay ?? 0;
  return mapOptions(scenario, (option) =>
    option.current ? option : { ...option, lyingHoursPerDay: Math.min(24, Math.max(0, base + (option.lyingHoursPerDay - base) * m)) },
  );
}

const SCALERS: Readonly<Record<RiskInputKey, (scenario: Scenario, m: number) => Scenario>> = {
  milkPrice: scaleMilkPrice,
  yieldResponse: scaleYieldResponse,
  capitalCost: scaleCapitalCost,
  interestRate: scaleInterestRate,
  wage: scaleWage,
  beddingPrice: scaleBeddingPrice,
  fertiliserPrice: scaleFertiliserPrices,
  herdSize: scaleHerdSize,
  housedFeedCost: scaleHousedFeedCost,
  grazingFeedCost: scaleGrazingFeedCost,
  marginalFeedCost: scaleMarginalFeedCost,
  systemYield: scaleSystemYield,
  healthCostPerCase: scaleHealthCostPerCase,
  manureHandlingCost: scaleManureHandlingCost,
  milkFeedGrowthGap: shiftMilkFeedGrowthGap,
  lyingHours: scaleLyingGain,
};

/**
 * Inputs that move none of the steady lines (`steady-lines.ts`: bedding, health, culling, herd
 * replacement, other cow costs, energy, manure; herd, stalls and housed days): a run drawing only
 * these builds those lines once. A key left out is simply rebuilt every draw.
 */
export const KEYS_LEAVING_STEADY_LINES: ReadonlySet<RiskInputKey> = new Set<RiskInputKey>([
  'milkPrice',
  'yieldResponse',
  'capitalCost',
  'interestRate',
  'wage',
  'housedFeedCost',
  'grazingFeedCost',
  'marginalFeedCost',
  'systemYield',
  'milkFeedGrowthGap',
  'lyingHours',
]);

/** Applies one multiplier to one key input; returns a new scenario, the input untouched. */
export function perturb(scenario: Scenario, key: RiskInputKey, multiplier: number): Scenario {
  return multiplier === 1 ? scenario : SCALERS[key](scenario, multiplier);
}

/** Applies a multiplier per key input (absent = 1); returns a new scenario, the input untouched. */
export function applyMultipliers(scenario: Scenario, multipliers: Multipliers): Scenario {
  let result = scenario;
  for (const [key, multiplier] of Object.entries(multipliers) as [RiskInputKey, number | undefined][]) {
    if (multiplier !== undefined) result = perturb(result, key, multiplier);
  }
  return result;
}
