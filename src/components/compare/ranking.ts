/**
 * The comparison's measures and the ranking of the candidates by one of them. Pure: takes the
 * engine's OptionSummary values as they are; the current option is the reference, not ranked; a
 * measure a candidate lacks (null) ranks after every candidate that has it, ties keep the
 * scenario's option order.
 */
import { isCandidate } from '@shared/candidates';
import type { OptionSummary } from '@shared/engine';

export type MeasureKind = 'money' | 'percent' | 'years' | 'ratio' | 'hours' | 'tonnes';

export interface Measure {
  key: MeasureKey;
  label: string;
  kind: MeasureKind;
  /** True when a larger value is better for the farm. */
  higherIsBetter: boolean;
  /** The option's value, straight from the engine's result (year-1 figures for yearly quantities). */
  value(option: OptionSummary): number | null;
}

export type MeasureKey =
  | 'npv'
  | 'incrementalNpv'
  | 'irr'
  | 'mirr'
  | 'paybackYears'
  | 'discountedPaybackYears'
  | 'profitabilityIndex'
  | 'capitalPerStall'
  | 'equivalentAnnualCostPerStall'
  | 'labourHours'
  | 'beddingTonnes'
  | 'manureValue'
  | 'lowestCoverage'
  | 'paybackFromOperationsYears'
  | 'lowestProjectCoverage'
  | 'stressedCoverage';

const year1 = (values: readonly number[]): number | null => values[1] ?? null;

/**
 * Each option's own flows hold the whole herd's margin, so their IRR and payback say nothing
 * about the decision: the rate-of-return measures are taken on the change against the current
 * option, which itself has none.
 */
const change = (o: OptionSummary) => (o.current ? undefined : o.incremental);

/** An IRR of flows that start with a saving is a borrowing rate, not a return: not ranked. */
const investmentIrr = (o: OptionSummary): number | null => {
  const inc = change(o);
  return inc && inc.irrKind !== 'borrowing' ? inc.irr : null;
};

/** Lowest whole-farm coverage under the bank's combined shock: milk −10 % with interest +2 points. */
const stressedCoverage = (o: OptionSummary): number | null => o.stress.find((s) => s.id === 'milk-10-rate+2')?.lowestCoverage ?? null;

/**
 * Every measure the comparison shows, in table order: the change against the current option
 * first, then coverage as the bank reads it, then the option's own figures (its NPV holds the
 * whole herd's margin and is labelled so).
 */
export const MEASURES: readonly Measure[] = [
  { key: 'incrementalNpv', label: 'NPV of the change against the current option', kind: 'money', higherIsBetter: true, value: (o) => change(o)?.npv ?? null },
  { key: 'irr', label: 'IRR of the change', kind: 'percent', higherIsBetter: true, value: (o) => investmentIrr(o) },
  { key: 'mirr', label: 'MIRR of the change', kind: 'percent', higherIsBetter: true, value: (o) => change(o)?.mirr ?? null },
  { key: 'paybackFromOperationsYears', label: 'Payback of the change from operations', kind: 'years', higherIsBetter: false, value: (o) => change(o)?.paybackFromOperationsYears ?? null },
  { key: 'paybackYears', label: 'Payback of the change, salvage and herd value included', kind: 'years', higherIsBetter: false, value: (o) => change(o)?.paybackYears ?? null },
  { key: 'discountedPaybackYears', label: 'Discounted payback of the change', kind: 'years', higherIsBetter: false, value: (o) => change(o)?.discountedPaybackYears ?? null },
  { key: 'profitabilityIndex', label: 'Profitability index of the change', kind: 'ratio', higherIsBetter: true, value: (o) => change(o)?.profitabilityIndex ?? null },
  { key: 'lowestCoverage', label: 'Lowest whole-farm coverage', kind: 'ratio', higherIsBetter: true, value: (o) => o.lowestCoverage?.value ?? null },
  { key: 'lowestProjectCoverage', label: 'Lowest project coverage', kind: 'ratio', higherIsBetter: true, value: (o) => (o.current ? null : (o.lowestProjectCoverage?.value ?? null)) },
  { key: 'stressedCoverage', label: 'Lowest whole-farm coverage, milk −10 % and interest +2 points', kind: 'ratio', higherIsBetter: true, value: stressedCoverage },
  { key: 'capitalPerStall', label: 'Capital per stall', kind: 'money', higherIsBetter: false, value: (o) => o.capitalPerStall },
  { key: 'equivalentAnnualCostPerStall', label: 'Equivalent annual cost per stall', kind: 'money', higherIsBetter: false, value: (o) => o.equivalentAnnualCostPerStall },
  { key: 'labourHours', label: 'Labour, year 1 (h)', kind: 'hours', higherIsBetter: false, value: (o) => year1(o.labourHoursPerYear) },
  { key: 'beddingTonnes', label: 'Bedding bought, year 1 (t)', kind: 'tonnes', higherIsBetter: false, value: (o) => year1(o.beddingTonnesPerYear) },
  { key: 'manureValue', label: 'Manure fertiliser value, year 1', kind: 'money', higherIsBetter: true, value: (o) => year1(o.manureFertiliserValuePerYear) },
  { key: 'npv', label: "NPV of the whole herd's margin (not a return on the barn)", kind: 'money', higherIsBetter: true, value: (o) => o.npv },
];

/** The measure with this key (the NPV of the change when the key is unknown, e.g. from an old saved preference). */
export function measureByKey(key: string): Measure {
  return MEASURES.find((m) => m.key === key) ?? (MEASURES[0] as Measure);
}

export interface RankedOption {
  option: OptionSummary;
  /** 1 = best; candidates with the same value share a rank; null for the current option (the reference) or when the option lacks the measure. */
  rank: number | null;
  value: number | null;
}

/**
 * The current option first, as the reference and without a rank (shared/candidates.ts), then the
 * candidates best first by `measure` (direction from the measure), those without a value last;
 * equal values share a rank (competition ranking, 1-2-2-4), ties in scenario order.
 */
export function rankOptions(options: readonly OptionSummary[], measure: Measure): RankedOption[] {
  const references = options.filter((option) => !isCandidate(option)).map((option) => ({ option, rank: null, value: measure.value(option) }));
  const entries = options.filter(isCandidate).map((option, index) => ({ option, index, value: measure.value(option) }));
  const sign = measure.higherIsBetter ? -1 : 1;
  entries.sort((a, b) => {
    if (a.value === null || b.value === null) return a.value === null ? (b.value === null ? a.index - b.index : 1) : -1;
    return sign * (a.value - b.value) || a.index - b.index;
  });
  const ranked: RankedOption[] = [];
  entries.forEach((entry, position) => {
    const previous = ranked[position - 1];
    let rank: number | null = null;
    if (entry.value !== null) rank = previous && previous.value === entry.value ? (previous.rank ?? position + 1) : position + 1;
    ranked.push({ option: entry.option, rank, value: entry.value });
  });
  return [...references, ...ranked];
}
