import type { MonteCarloInput, RiskInputKey, RiskSettings, Scenario } from '../../schema';
import { KEYS_LEAVING_STEADY_LINES, perturb } from './perturb';
import { createRandom, type Random } from './random';
import { normalCdf, normalQuantile, triangularQuantile, truncatedNormalQuantile } from './distributions';
import { histogram, mean, percentileSorted, sortedCopy, type HistogramBin } from './statistics';
import { anchoredForShocks, evaluateNpvOnly, steadyLinesOf } from '../evaluate';

type SchemaMonteCarlo = RiskSettings['monteCarlo'];
/**
 * Monte Carlo settings as the scenario schema holds them: draws, seed, uncertain inputs, and
 * optionally the milk–feed correlation (default 0.5, an assumption: feed and milk markets tend
 * to move together; common practice, no source) and yearly price draws (default off).
 */
export type MonteCarloSettings = Omit<SchemaMonteCarlo, 'milkFeedCorrelation' | 'pricesPerYear'> &
  Partial<Pick<SchemaMonteCarlo, 'milkFeedCorrelation' | 'pricesPerYear'>>;

export const DEFAULT_MILK_FEED_CORRELATION = 0.5;

/** Hooks for driving a run: progress after every block, cancellation checked between blocks. */
export interface MonteCarloRunOptions {
  /** Called after every block with draws done and draws requested. */
  onProgress?(done: number, total: number): void;
  /** Checked before every block; true stops the run and marks the result cancelled. */
  isCancelled?(): boolean;
  /** Histogram bins for the NPV distributions (default 40). */
  histogramBins?: number;
}

/** Mean and P10/P50/P90 of a sample (currency, or a fraction for IRR); null when no draw defined it. */
export interface DistributionSummary {
  readonly mean: number | null;
  readonly p10: number | null;
  readonly p50: number | null;
  readonly p90: number | null;
}

/** NPV distribution of one option (or of its difference to the current option), in currency. */
export interface NpvDistribution extends DistributionSummary {
  readonly histogram: HistogramBin[];
  /** Share of draws with NPV < 0 (0..1); null before any draw. */
  readonly probabilityNegative: number | null;
}

/** IRR distribution over the draws where IRR is defined (fraction per year). */
export interface IrrDistribution extends DistributionSummary {
  readonly definedDraws: number;
}

/** Monte Carlo result for one option. */
export interface OptionMonteCarloResult {
  readonly optionId: string;
  readonly name: string;
  readonly current: boolean;
  readonly npv: NpvDistribution;
  /** NPV of the option minus the current option's, draw by draw; null for the current option itself. */
  readonly incrementalNpv: NpvDistribution | null;
  /**
   * Share of draws in which the option's lowest yearly whole-farm debt-service coverage falls below the
   * lender's threshold (0..1). Null with `coverageReason` when no draw is done yet or no draw
   * has debt service to cover.
   */
  readonly probabilityCoverageBelowThreshold: number | null;
  readonly coverageReason: 'no-draws' | 'no-debt-service' | null;
  readonly irr: IrrDistribution;
}

/** Result of a Monte Carlo run, complete or stopped early. */
export interface MonteCarloResult {
  readonly seed: number;
  readonly drawsRequested: number;
  readonly drawsDone: number;
  /** True when the run was stopped before all requested draws were done. */
  readonly cancelled: boolean;
  readonly coverageThreshold: number;
  readonly options: OptionMonteCarloResult[];
}

/**
 * Draws come in fixed blocks: block b holds draws b·250 … b·250 + 249 and draws them from its
 * own random stream (the seed's stream b, `random.ts`). A draw's numbers therefore depend only on
 * the seed and its index, so blocks can run in any order, on any number of workers, and merge
 * to the same result as one sequential run. Changing the size changes every result.
 */
export const MONTE_CARLO_BLOCK_DRAWS = 250;
const DEFAULT_BINS = 40;

/** Blocks a run of `draws` draws fills (the last may be short). */
export function monteCarloBlockCount(draws: number): number {
  return Math.ceil(Math.max(0, Math.floor(draws)) / MONTE_CARLO_BLOCK_DRAWS);
}

/** A run's fixed part, the same for every block: worked out once per run (or per worker). */
export interface PreparedMonteCarlo {
  /** The scenario as drawn: the existing farm's cash anchored to the current option's margin. */
  readonly scenario: Scenario;
  readonly settings: MonteCarloSettings;
  /** Draws requested. */
  readonly total: number;
  /** Blocks the requested draws fill (the last may be short). */
  readonly blocks: number;
  readonly drawOptions: Parameters<typeof evaluateNpvOnly>[1];
}

/** Raw outcomes of some draws of one option. */
export interface OptionSamples {
  readonly npv: Float64Array;
  /** NPV minus the current option's, draw by draw (0 for the current option). */
  readonly incrementalNpv: Float64Array;
  /** IRR of the draws where it is defined. */
  readonly irr: Float64Array;
  readonly coverageBelow: number;
  readonly coverageDefined: number;
}

/** Raw outcomes of a range of blocks, per option in scenario order: what a worker sends back. */
export interface MonteCarloSamples {
  readonly draws: number;
  readonly options: OptionSamples[];
}

/** Prepares a seeded run over the scenario's options (floating point; same seed and settings → identical results). */
export function prepareMonteCarlo(entered: Scenario, settings: MonteCarloSettings = entered.risk.monteCarlo): PreparedMonteCarlo {
  // Every draw moves the existing farm's cash with the current option's margin at the draw's prices.
  const scenario = anchoredForShocks(entered);
  const total = Math.max(0, Math.floor(settings.draws));
  // Each draw's IRR search starts from the unperturbed IRR, close to where most draws land.
  const irrStart = total > 0 ? evaluateNpvOnly(scenario).map((result) => result.irr) : [];
  const steadyLines = total > 0 && settings.inputs.every((input) => KEYS_LEAVING_STEADY_LINES.has(input.key)) ? steadyLinesOf(scenario) : undefined;
  return { scenario, settings, total, blocks: monteCarloBlockCount(total), drawOptions: { irrStart, steadyLines } };
}

/** Draws requested in blocks `from` … `to − 1`. */
function drawsInBlocks(prepared: PreparedMonteCarlo, from: number, to: number): number {
  const start = Math.min(prepared.total, Math.max(0, from) * MONTE_CARLO_BLOCK_DRAWS);
  return Math.max(0, Math.min(prepared.total, Math.max(0, to) * MONTE_CARLO_BLOCK_DRAWS) - start);
}

/**
 * Runs blocks `from` … `to − 1` (each on its own stream) and returns their raw outcomes. Draw i
 * perturbs the scenario by one multiplier per uncertain input and evaluates every option on it.
 */
export function runMonteCarloBlocks(prepared: PreparedMonteCarlo, from: number, to: number): MonteCarloSamples {
  const { scenario, settings, drawOptions } = prepared;
  const threshold = scenario.finance.coverageThreshold;
  const draws = drawsInBlocks(prepared, from, to);
  const npvs = scenario.options.map(() => new Float64Array(draws));
  const incrementals = scenario.options.map(() => new Float64Array(draws));
  const irrs = scenario.options.map(() => new Float64Array(draws));
  const irrCounts = scenario.options.map(() => 0);
  const coverageBelow = scenario.options.map(() => 0);
  const coverageDefined = scenario.options.map(() => 0);
  let done = 0;
  for (let block = Math.max(0, from); done < draws; block += 1) {
    const random = createRandom(settings.seed, block);
    const end = done + drawsInBlocks(prepared, block, block + 1);
    for (; done < end; done += 1) {
      evaluateNpvOnly(drawScenario(scenario, settings, random), drawOptions).forEach((outcome, i) => {
        (npvs[i] as Float64Array)[done] = outcome.npv;
        (incrementals[i] as Float64Array)[done] = outcome.incrementalNpv ?? 0;
        if (outcome.irr !== null) {
          const at = irrCounts[i] ?? 0;
          (irrs[i] as Float64Array)[at] = outcome.irr;
          irrCounts[i] = at + 1;
        }
        if (outcome.minCoverage !== null) {
          coverageDefined[i] = (coverageDefined[i] ?? 0) + 1;
          if (outcome.minCoverage < threshold) coverageBelow[i] = (coverageBelow[i] ?? 0) + 1;
        }
      });
    }
  }
  return {
    draws,
    options: scenario.options.map((_, i) => ({
      npv: npvs[i] as Float64Array,
      incrementalNpv: incrementals[i] as Float64Array,
      irr: (irrs[i] as Float64Array).slice(0, irrCounts[i]),
      coverageBelow: coverageBelow[i] ?? 0,
      coverageDefined: coverageDefined[i] ?? 0,
    })),
  };
}

/**
 * One multiplier per uncertain input, each consuming exactly one uniform in the order the
 * inputs are listed, so the stream stays aligned draw by draw whatever the distributions.
 * A normal without a lower cut is cut at 0: a negative multiplier would make a price, rate or
 * herd negative.
 */
export function sampleMultiplier(input: MonteCarloInput, random: Random): number {
  return multiplierAt(input, random.next());
}

/** The input's multiplier at probability u ∈ [0, 1] (its inverse CDF). */
export function multiplierAt(input: MonteCarloInput, u: number): number {
  if (input.distribution === 'triangular') return triangularQuantile(input, u);
  return truncatedNormalQuantile({ mean: input.mean, sd: input.sd, min: input.min ?? 0, max: input.max }, u);
}

/** Inputs that move feed cost: drawn correlated with the milk price. */
const FEED_KEYS: ReadonlySet<RiskInputKey> = new Set(['housedFeedCost', 'grazingFeedCost', 'marginalFeedCost']);
/** Inputs drawn once per year when `pricesPerYear` is on. */
const isPrice = (key: RiskInputKey): boolean => key === 'milkPrice' || FEED_KEYS.has(key);

/** Keeps a uniform off 0 and 1, where Φ⁻¹ is infinite. */
const open01 = (u: number): number => Math.min(Math.max(u, 1e-12), 1 - 1e-12);

/**
 * One uniform per input, the feed inputs' bent towards the milk price's by a Gaussian copula:
 * z_feed = ρ·z_milk + √(1 − ρ²)·z_own, u = Φ(z_feed). Each input still consumes exactly one
 * uniform, so ρ = 0 gives the uncorrelated draw and the stream stays aligned.
 */
export function correlatedUniforms(inputs: readonly MonteCarloInput[], random: Random, rho: number): number[] {
  const uniforms = inputs.map(() => random.next());
  const milkAt = inputs.findIndex((input) => input.key === 'milkPrice');
  if (milkAt < 0 || rho === 0) return uniforms;
  const zMilk = normalQuantile(open01(uniforms[milkAt] ?? 0.5));
  const spread = Math.sqrt(1 - rho * rho);
  return uniforms.map((u, i) => (FEED_KEYS.has(inputs[i]?.key ?? 'milkPrice') ? normalCdf(rho * zMilk + spread * normalQuantile(open01(u))) : u));
}

/**
 * Draws one scenario. Non-price inputs get one multiplier for the whole horizon, applied in input
 * order (two inputs on one key compound). Prices are drawn the same way, or with `pricesPerYear`
 * once per operating year into the yearly price index (milk price; every feed input moves all
 * feed cost that year), so a trough can last one or two years instead of the whole horizon.
 */
function drawScenario(base: Scenario, settings: MonteCarloSettings, random: Random): Scenario {
  const { inputs, milkFeedCorrelation: rho = DEFAULT_MILK_FEED_CORRELATION, pricesPerYear = false } = settings;
  const once = correlatedUniforms(inputs, random, rho);
  let scenario = base;
  inputs.forEach((input, i) => {
    if (!(pricesPerYear && isPrice(input.key))) scenario = perturb(scenario, input.key, multiplierAt(input, once[i] ?? 0.5));
  });
  const priceInputs = pricesPerYear ? inputs.filter((input) => isPrice(input.key)) : [];
  if (priceInputs.length === 0) return scenario;
  const index = base.herd.yearlyPriceIndex;
  const milk: number[] = [];
  const feed: number[] = [];
  for (let t = 0; t < base.horizonYears; t++) {
    const yearly = correlatedUniforms(priceInputs, random, rho);
    let milkM = index.milkPrice?.[t] ?? 1;
    let feedM = index.feed?.[t] ?? 1;
    priceInputs.forEach((input, i) => {
      const m = multiplierAt(input, yearly[i] ?? 0.5);
      if (input.key === 'milkPrice') milkM *= m;
      else feedM *= m;
    });
    milk.push(milkM);
    feed.push(feedM);
  }
  return { ...scenario, herd: { ...scenario.herd, yearlyPriceIndex: { milkPrice: milk, feed } } };
}

function summarise(values: Float64Array): DistributionSummary {
  const sorted = sortedCopy(values);
  return {
    mean: mean(sorted),
    p10: percentileSorted(sorted, 0.1),
    p50: percentileSorted(sorted, 0.5),
    p90: percentileSorted(sorted, 0.9),
  };
}

function npvDistribution(values: Float64Array, bins: number): NpvDistribution {
  let negative = 0;
  for (const v of values) if (v < 0) negative += 1;
  return {
    ...summarise(values),
    histogram: histogram(values, bins),
    probabilityNegative: values.length === 0 ? null : negative / values.length,
  };
}

/** The values of every part end to end. */
function joined(parts: readonly Float64Array[]): Float64Array {
  const all = new Float64Array(parts.reduce((n, part) => n + part.length, 0));
  let at = 0;
  for (const part of parts) {
    all.set(part, at);
    at += part.length;
  }
  return all;
}

/**
 * Summarises the raw outcomes of any set of blocks, given in any order or grouping: every
 * figure comes from sorted values or counts, so the same draws give the same result bit for bit.
 * `cancelled` says the run stopped before the blocks missing from `parts` were done.
 */
export function mergeMonteCarloSamples(
  prepared: PreparedMonteCarlo,
  parts: readonly MonteCarloSamples[],
  options: { cancelled?: boolean; histogramBins?: number } = {},
): MonteCarloResult {
  const { scenario, settings, total } = prepared;
  const bins = options.histogramBins ?? DEFAULT_BINS;
  const done = parts.reduce((n, part) => n + part.draws, 0);
  const of = (i: number): OptionSamples[] => parts.map((part) => part.options[i] as OptionSamples);
  return {
    seed: settings.seed,
    drawsRequested: total,
    drawsDone: done,
    cancelled: (options.cancelled ?? false) && done < total,
    coverageThreshold: scenario.finance.coverageThreshold,
    options: scenario.options.map((option, i) => {
      const samples = of(i);
      const irr = joined(samples.map((s) => s.irr));
      const defined = samples.reduce((n, s) => n + s.coverageDefined, 0);
      const below = samples.reduce((n, s) => n + s.coverageBelow, 0);
      return {
        optionId: option.id,
        name: option.name,
        current: option.current,
        npv: npvDistribution(joined(samples.map((s) => s.npv)), bins),
        incrementalNpv: option.current ? null : npvDistribution(joined(samples.map((s) => s.incrementalNpv)), bins),
        // A draw without debt service cannot breach the threshold; it still counts in the denominator.
        probabilityCoverageBelowThreshold: defined === 0 || done === 0 ? null : below / done,
        coverageReason: done === 0 ? 'no-draws' : defined === 0 ? 'no-debt-service' : null,
        irr: { ...summarise(irr), definedDraws: irr.length },
      };
    }),
  };
}

/**
 * Runs a whole Monte Carlo synchronously, block after block, reporting progress after each and
 * stopping early when `isCancelled()` turns true. Same seed and settings → identical result, the
 * same as any split of the blocks merged.
 */
export function runMonteCarlo(scenario: Scenario, settings: MonteCarloSettings = scenario.risk.monteCarlo, options: MonteCarloRunOptions = {}): MonteCarloResult {
  const prepared = prepareMonteCarlo(scenario, settings);
  const parts: MonteCarloSamples[] = [];
  let done = 0;
  for (let block = 0; block < prepared.blocks; block += 1) {
    if (options.isCancelled?.()) return mergeMonteCarloSamples(prepared, parts, { cancelled: true, histogramBins: options.histogramBins });
    const part = runMonteCarloBlocks(prepared, block, block + 1);
    parts.push(part);
    done += part.draws;
    options.onProgress?.(done, prepared.total);
  }
  return mergeMonteCarloSamples(prepared, parts, { histogramBins: options.histogramBins });
}
