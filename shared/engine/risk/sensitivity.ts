import type { RiskSettings, Scenario } from '../../schema';
import { riskInputKeys, sensitivityInputKeys, type RiskInputKey } from '../../schema/risk-keys';
import { anchoredForShocks, evaluateNpvOnly } from '../evaluate';
import type { FastOptionResult } from '../results';
import { perturb } from './perturb';

/** Low/high change per key input as fractions of the base value (−0.2 = 20 % lower). */
export type SensitivityRanges = RiskSettings['sensitivity'];

/** NPV (currency) with one input at its low and at its high value, the others at base. */
export interface InputSwing {
  readonly key: RiskInputKey;
  /** Multipliers applied to the base value: 1 + low change, 1 + high change. */
  readonly lowMultiplier: number;
  readonly highMultiplier: number;
  readonly atLow: number;
  readonly atHigh: number;
  /** |atHigh − atLow| (currency): the bar length of a tornado chart. */
  readonly swing: number;
}

/**
 * Lowest yearly whole-farm coverage with one input at its low and at its high value (ratio; null
 * in a run with nothing to cover). The loan interest rate leaves the project NPV nearly still
 * (the NPV is unlevered: only the tax on interest moves it) but moves this figure.
 */
export interface CoverageSwing {
  readonly key: RiskInputKey;
  readonly atLow: number | null;
  readonly atHigh: number | null;
  /** |atHigh − atLow| (ratio), 0 when either end is null. */
  readonly swing: number;
}

/** Sensitivity of one option: its own NPV and, for a candidate, its NPV against the current option. */
export interface OptionSensitivity {
  readonly optionId: string;
  readonly name: string;
  readonly current: boolean;
  readonly baseNpv: number;
  /** Own NPV per input, sorted by swing, largest first. */
  readonly npv: InputSwing[];
  /** Incremental NPV (option − current) at base; null for the current option. */
  readonly baseIncrementalNpv: number | null;
  /** Incremental NPV per input, sorted by swing, largest first; null for the current option. */
  readonly incrementalNpv: InputSwing[] | null;
  /** Lowest whole-farm coverage at base; null when there is no debt service. */
  readonly baseLowestCoverage: number | null;
  /** Lowest whole-farm coverage per input, in the order of `incrementalNpv` (own NPV for the current option). */
  readonly lowestCoverage: CoverageSwing[];
}

export interface SensitivityResult {
  readonly horizonYears: number;
  readonly currency: string;
  readonly options: OptionSensitivity[];
}

/** Largest swing first; equal swings keep the schema's input order so charts do not reshuffle. */
const bySwing = (a: InputSwing, b: InputSwing): number =>
  b.swing - a.swing || riskInputKeys.indexOf(a.key) - riskInputKeys.indexOf(b.key);

/**
 * One-at-a-time sensitivity (floating point, currency of the scenario): every key input at its
 * low and its high value (default the scenario's ranges, ±20 %), the others at base. Reports
 * per option both its own NPV and its incremental NPV against the current option (the one a
 * building decision turns on), each list sorted by swing, largest first. `ranges` may override
 * some inputs; the rest come from the scenario.
 */
export function sensitivity(entered: Scenario, ranges: Partial<SensitivityRanges> = {}): SensitivityResult {
  // The existing farm's cash moves with the current option's margin at each input's low and high value.
  const scenario = anchoredForShocks(entered);
  const base = evaluateNpvOnly(scenario);
  const runs = sensitivityInputKeys.map((key) => {
    const range = ranges[key] ?? scenario.risk.sensitivity[key];
    const lowMultiplier = 1 + range.low;
    const highMultiplier = 1 + range.high;
    return {
      key,
      lowMultiplier,
      highMultiplier,
      low: evaluateNpvOnly(perturb(scenario, key, lowMultiplier)),
      high: evaluateNpvOnly(perturb(scenario, key, highMultiplier)),
    };
  });
  const swingsOf = (i: number, pick: (result: FastOptionResult | undefined) => number): InputSwing[] =>
    runs
      .map(({ key, lowMultiplier, highMultiplier, low, high }) => {
        const atLow = pick(low[i]);
        const atHigh = pick(high[i]);
        return { key, lowMultiplier, highMultiplier, atLow, atHigh, swing: Math.abs(atHigh - atLow) };
      })
      .sort(bySwing);

  return {
    horizonYears: scenario.horizonYears,
    currency: scenario.currency,
    options: scenario.options.map((option, i) => {
      const own = base[i];
      const incremental = option.current ? null : swingsOf(i, (result) => result?.incrementalNpv ?? 0);
      const order = (incremental ?? swingsOf(i, (result) => result?.npv ?? 0)).map((swing) => swing.key);
      const lowestCoverage = order.map((key): CoverageSwing => {
        const run = runs.find((r) => r.key === key);
        const atLow = run?.low[i]?.minCoverage ?? null;
        const atHigh = run?.high[i]?.minCoverage ?? null;
        return { key, atLow, atHigh, swing: atLow === null || atHigh === null ? 0 : Math.abs(atHigh - atLow) };
      });
      return {
        optionId: option.id,
        name: option.name,
        current: option.current,
        baseNpv: own?.npv ?? 0,
        npv: swingsOf(i, (result) => result?.npv ?? 0),
        baseIncrementalNpv: option.current ? null : (own?.incrementalNpv ?? 0),
        incrementalNpv: incremental,
        baseLowestCoverage: own?.minCoverage ?? null,
        lowestCoverage,
      };
    }),
  };
}
