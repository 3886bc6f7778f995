/**
 * The series behind every comparison chart, built from the engine's results (and, for the
 * capital make-up, the engine's own capital-line costing). Each chart and its "Show as table"
 * view read the same ChartData, so the table is exactly what the chart draws. Pure.
 */
import { capitalAssets, cumulative, discount, type OptionResult, type ScenarioResults } from '@shared/engine';
import { isCandidate } from '@shared/candidates';
import type { Scenario } from '@shared/schema';
import { optionColour, optionDash } from '@/composables/useOptionColours';
import { sumCents } from '@/components/results/projection-rows';
import { CAPITAL_CATEGORY_LABELS } from '@/components/capital-categories';

export interface ChartSeries {
  name: string;
  data: (number | null)[];
  colour: string;
  /** Dash length for line charts (0 = solid). */
  dash?: number;
}

export interface ChartData {
  /** X-axis categories: years, or option names for the make-up charts. */
  categories: string[];
  /** What the categories are, for the axis title and the table's first column. */
  categoryTitle: string;
  series: ChartSeries[];
  /** What the values are: currency, or a ratio such as coverage. */
  unit: 'money' | 'ratio';
}

/** A neutral sequence for cost categories (not options), distinct from the option colours by lightness. */
const CATEGORY_COLOURS = ['#3f6f5a', '#8fb996', '#e0b64a', '#b5562b', '#26323a', '#7f786a', '#5e9679', '#c7bfae', '#a14a22', '#d5e7dc', '#464b4c', '#efdfb0'];

const yearLabels = (count: number, from = 0): string[] => Array.from({ length: count }, (_, t) => String(t + from));
const indexOf = (scenario: Scenario, id: string): number => Math.max(0, scenario.options.findIndex((o) => o.id === id));

/**
 * Cumulative discounted cash flow of each change against the current option, years 0..H, at the
 * scenario's discount rate (currency): an option's own flows hold the whole herd's margin and would
 * show every barn paying back at once, so only the change is drawn (its year H holds the salvage
 * and herd value).
 */
export function cumulativeDiscountedChart(scenario: Scenario, results: ScenarioResults): ChartData {
  const rate = scenario.finance.discountRate;
  return {
    categories: yearLabels(results.horizonYears + 1),
    categoryTitle: 'Year',
    unit: 'money',
    series: results.options.filter(isCandidate).map((o) => ({
      name: o.name,
      data: cumulative(discount(rate, o.incremental.cashFlows)).map((v) => Math.round(v * 100) / 100),
      colour: optionColour(indexOf(scenario, o.id)),
      dash: optionDash(indexOf(scenario, o.id)),
    })),
  };
}

/** Yearly incremental cash flow of each option against the current option, years 0..H (currency). */
export function incrementalCashFlowChart(scenario: Scenario, results: ScenarioResults): ChartData {
  return {
    categories: yearLabels(results.horizonYears + 1),
    categoryTitle: 'Year',
    unit: 'money',
    series: results.options
      .filter(isCandidate)
      .map((o) => ({ name: o.name, data: [...o.incremental.cashFlows], colour: optionColour(indexOf(scenario, o.id)) })),
  };
}


/** Year-0 capital per category for one option (currency, to the cent), costed as the engine costs it. */
export function capitalByCategory(scenario: Scenario, result: OptionResult): Map<string, number> {
  const option = scenario.options.find((o) => o.id === result.id);
  const totals = new Map<string, number>();
  if (!option) return totals;
  const sized = { stalls: result.sizing.stalls, storageM3: result.sizing.manureStorageM3, troughs: option.water.troughs };
  const categoryOf = new Map(option.capitalLines.map((l) => [l.id, l.kind === 'item' ? l.category : 'contingency']));
  for (const asset of capitalAssets(option.capitalLines, sized)) {
    const category = categoryOf.get(asset.id) ?? 'other';
    totals.set(category, (totals.get(category) ?? 0) + asset.cost);
  }
  for (const [key, value] of totals) totals.set(key, Math.round(value * 100) / 100);
  return totals;
}

/** Capital make-up, stacked by category, one bar per option (currency). */
export function capitalMakeUpChart(scenario: Scenario, results: ScenarioResults): ChartData {
  const perOption = results.options.map((o) => capitalByCategory(scenario, o));
  const used = (Object.keys(CAPITAL_CATEGORY_LABELS) as (keyof typeof CAPITAL_CATEGORY_LABELS)[]).filter((c) => perOption.some((m) => (m.get(c) ?? 0) !== 0));
  return {
    categories: results.options.map((o) => o.name),
    categoryTitle: 'Option',
    unit: 'money',
    series: used.map((c, i) => ({
      name: CAPITAL_CATEGORY_LABELS[c] ?? c,
      data: perOption.map((m) => m.get(c) ?? 0),
      colour: CATEGORY_COLOURS[i % CATEGORY_COLOURS.length] ?? '#7f786a',
    })),
  };
}

const RUNNING_GROUPS: { label: string; keys: (keyof OptionResult['years'][number])[] }[] = [
  { label: 'Feed', keys: ['feed'] },
  { label: 'Labour', keys: ['labourScraping', 'labourBedCare', 'labourBeddingTopUp', 'labourTroughs', 'labourGrazing', 'labourMilking'] },
  { label: 'Bedding material', keys: ['bedding'] },
  { label: 'Health, culling and replacement', keys: ['health', 'culling', 'herdReplacement'] },
  { label: 'Other cow costs', keys: ['otherCowCosts'] },
  { label: 'Maintenance', keys: ['maintenance'] },
  { label: 'Energy', keys: ['energy'] },
  { label: 'Manure handling', keys: ['manureHandling'] },
  { label: 'Other running costs', keys: ['runningCosts'] },
];

/** Running-cost make-up in operating year 1, stacked by group, one bar per option (currency, nominal). */
export function runningCostMakeUpChart(results: ScenarioResults): ChartData {
  return {
    categories: results.options.map((o) => o.name),
    categoryTitle: 'Option',
    unit: 'money',
    series: RUNNING_GROUPS.map((group, i) => ({
      name: group.label,
      data: results.options.map((o) => {
        const year = o.years[1];
        return year ? sumCents(group.keys.map((k) => Number(year[k]))) : 0;
      }),
      colour: CATEGORY_COLOURS[i % CATEGORY_COLOURS.length] ?? '#7f786a',
    })),
  };
}

/** Whole-farm debt-service coverage per option, years 1..H (ratio; null where nothing is due). */
export function coverageChart(scenario: Scenario, results: ScenarioResults): ChartData {
  return {
    categories: yearLabels(results.horizonYears, 1),
    categoryTitle: 'Year',
    unit: 'ratio',
    series: results.options.map((o) => ({
      name: o.name,
      data: o.coverage.map((c) => (c.wholeFarm === null ? null : Math.round(c.wholeFarm * 100) / 100)),
      colour: optionColour(indexOf(scenario, o.id)),
    })),
  };
}
