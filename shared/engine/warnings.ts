import type { Scenario } from '../schema';
import { milkLagsFeedBy } from './growth';
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

/** Every model warning of a scenario, in the order a reader should see them. */
export function scenarioWarnings(scenario: Scenario): ModelWarning[] {
  return [...growthWarnings(scenario)];
}
