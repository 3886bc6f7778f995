import type { Option, Scenario } from '../schema';
import { milkLagsFeedBy } from './growth';
import { cowsPerYear } from './herd-size';
import { MILK_DAYS_PER_YEAR } from './yield';
import type { ModelWarning } from './results';

/** Percent with one decimal for a fraction (0.015 → "1.5 %"). */
function percent(fraction: number): string {
  return `${(Math.round(fraction * 1000) / 10).toString()} %`;
}

/** Warning when milk is set to grow slower than feed: the gap alone compounds into a barn's loss over the horizon. */
export function growthWarnings(scenario: Scenario): ModelWarning[] {
  const gap = milkLagsFeedBy(scenario.herd.growth);
  if (gap <= 0) return [];
  return [
    {
      code: 'milk-growth-below-feed',
      message: `Milk price grows ${percent(gap)} a year slower than feed. Over ${scenario.horizonYears} years that gap alone can turn an option's result from gain to loss; check it is the farm's own view, not a leftover default.`,
    },
  ];
}

/**
 * Livestock manure N per hectare of the option's largest herd (kg N/ha/yr): N excreted per cow-day
 * × cows × 365 ÷ hectares, every day of the year counted (dung on pasture counts as much as the
 * store's), or null without hectares.
 */
export function organicNitrogenPerHa(scenario: Scenario, option: Option): number | null {
  const { hectares } = scenario.herd.land;
  if (hectares === null || hectares <= 0) return null;
  const cows = cowsPerYear(scenario.herd.cows, option.herdChange, scenario.horizonYears);
  const designCows = Math.max(0, ...cows.slice(1));
  return (scenario.herd.manureExcretion.nitrogenKgPerCowDay * designCows * MILK_DAYS_PER_YEAR) / hectares;
}

/** A note per option whose manure N per hectare passes the farm's own limit. */
export function nitrogenWarnings(scenario: Scenario): ModelWarning[] {
  const limit = scenario.herd.land.organicNitrogenLimitKgPerHa;
  if (limit === null) return [];
  return scenario.options.flatMap((option): ModelWarning[] => {
    const perHa = organicNitrogenPerHa(scenario, option);
    if (perHa === null || perHa <= limit) return [];
    return [
      {
        code: 'organic-nitrogen-over-limit',
        optionId: option.id,
        message: `${option.name}: the herd's manure carries about ${Math.round(perHa)} kg N per hectare a year, above the farm's limit of ${limit} kg. More land, export of manure or fewer cows is needed; check the local nutrient rules with an adviser.`,
      },
    ];
  });
}

/** Every model warning of a scenario, in the order a reader should see them. */
export function scenarioWarnings(scenario: Scenario): ModelWarning[] {
  return [...growthWarnings(scenario), ...nitrogenWarnings(scenario)];
}
