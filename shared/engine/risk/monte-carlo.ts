import type { MonteCarloInput, RiskInputKey, RiskSettings, Scenario } from '../../schema';
import { KEYS_LEAVING_STEADY_LINES, perturb } from './perturb';
import { createRandom, type Random } from './random';
import { normalCdf, normalQuantile, triangularQuantile, truncatedNormalQuantile } from './distributions';
import { histogram, mean, percentileSorted, sortedCopy, type HistogramBin } from './statistics';
import { anchoredForShocks, evaluateNpvOnly, steadyLinesOf } from '../evaluate';
import type { FastOptionResult } from '../results';

type SchemaMonteCarlo = RiskSettings['monteCarlo'];
/**
 * Monte Carlo settings as the scenario schema holds them: draws, seed, uncertain inputs, and
 * optionally the milk–feed correlation (default 0.5, an assumption: feed and milk markets tend
 * to move together; common practice, no source) and yearly price draws (default off).
 */
export type MonteCarloSettings = Omit<SchemaMonteCarlo, 'milkFeedCorrelation' | 'pricesPerYear'> &
  Partial<Pick<SchemaMonteCarlo, 'milkFeedCorrelation' | 'pricesPerYear'>>;

export const DEFAULT_MILK_FEED_CORRELATION = 0.5;

/** Hooks for driving a run: progress after every chunk, cancellation checked between chunks. */
export interface MonteCarloRunOptions {
  /** Called after every chunk with draws done and draws requested. */
  onProgress?(done: number, total: number): void;
  /** Checked before every chunk; true stops the run and marks the result cancelled. */
  isCancelled?(): boolean;
  /** Draws per chunk (default 250): the unit of progress and of cancellation latency. */
  chunkSize?: number;
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

/** A Monte Carlo run driven in chunks, e.g. from a Web Worker's message loop. */
export interface MonteCarloRun {
  readonly total: number;
  /** Draws done so far. */
  done(): number;
  /** True once every requested draw is done or the run was cancelled. */
  finished(): boolean;
  /** Runs up to `n` more draws; returns draws done so far. */
  step(n: number): number;
  /** Stops the run; later `step` calls do nothing and `result()` reports cancelled. */
  cancel(): void;
  /** Summary of the draws done so far. */
  result(): MonteCarloResult;
}

const DEFAULT_CHUNK = 250;
const DEFAULT_BINS = 40;

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

/**
 * Creates a seeded Monte Carlo run over the scenario's options (floating point; same seed and
 * settings → identical results, however the run is chunked). Draw i perturbs the scenario by
 * one multiplier per uncertain input and evaluates every option on the same draw.
 */
export function createMonteCarloRun(entered: Scenario, settings: MonteCarloSettings = entered.risk.monteCarlo, options: Pick<MonteCarloRunOptions, 'histogramBins'> = {}): MonteCarloRun {
  // Every draw moves the existing farm's cash with the current option's margin at the draw's prices.
  const scenario = anchoredForShocks(entered);
  const total = Math.max(0, Math.floor(settings.draws));
  const bins = options.histogramBins ?? DEFAULT_BINS;
  const random = createRandom(settings.seed);
  const optionCount = scenario.options.length;
  const npvs = scenario.options.map(() => new Float64Array(total));
  const incrementals = scenario.options.map(() => new Float64Array(total));
  const irrs = scenario.options.map(() => new Float64Array(total));
  const irrCounts = new Array<number>(optionCount).fill(0);
  const coverageBelow = new Array<number>(optionCount).fill(0);
  const coverageDefined = new Array<number>(optionCount).fill(0);
  const threshold = scenario.finance.coverageThreshold;
  let done = 0;
  let cancelled = false;
  // Each draw's IRR search starts from the unperturbed IRR, close to where most draws land.
  const irrStart = total > 0 ? evaluateNpvOnly(scenario).map((result) => result.irr) : [];
  const steadyLines = total > 0 && settings.inputs.every((input) => KEYS_LEAVING_STEADY_LINES.has(input.key)) ? steadyLinesOf(scenario) : undefined;
  const drawOptions = { irrStart, steadyLines };

  const record = (outcomes: readonly FastOptionResult[]): void => {
    outcomes.forEach((outcome, i) => {
      (npvs[i] as Float64Array)[done] = outcome.npv;
      (incrementals[i] as Float64Array)[done] = outcome.incrementalNpv ?? 0;
      if (outcome.irr !== null) {
        (irrs[i] as Float64Array)[irrCounts[i] ?? 0] = outcome.irr;
        irrCounts[i] = (irrCounts[i] ?? 0) + 1;
      }
      if (outcome.minCoverage !== null) {
        coverageDefined[i] = (coverageDefined[i] ?? 0) + 1;
        if (outcome.minCoverage < threshold) coverageBelow[i] = (coverageBelow[i] ?? 0) + 1;
      }
    });
  };

  const run: MonteCarloRun = {
    total,
    done: () => done,
    finished: () => cancelled || done >= total,
    step(n: number): number {
      const end = Math.min(total, done + Math.max(0, Math.floor(n)));
      while (!cancelled && done < end) {
        record(evaluateNpvOnly(drawScenario(scenario, settings, random), drawOptions));
        done += 1;
      }
      return done;
    },
    cancel(): void {
      if (done < total) cancelled = true;
    },
    result(): MonteCarloResult {
      return {
        seed: settings.seed,
        drawsRequested: total,
        drawsDone: done,
        cancelled,
        coverageThreshold: threshold,
        options: scenario.options.map((option, i) => {
          const npv = (npvs[i] as Float64Array).subarray(0, done);
          const irrCount = irrCounts[i] ?? 0;
          const defined = coverageDefined[i] ?? 0;
          return {
            optionId: option.id,
            name: option.name,
            current: option.current,
            npv: npvDistribution(npv, bins),
            incrementalNpv: option.current ? null : npvDistribution((incrementals[i] as Float64Array).subarray(0, done), bins),
            // A draw without debt service cannot breach the threshold; it still counts in the denominator.
            probabilityCoverageBelowThreshold: defined === 0 || done === 0 ? null : (coverageBelow[i] ?? 0) / done,
            coverageReason: done === 0 ? 'no-draws' : defined === 0 ? 'no-debt-service' : null,
            irr: { ...summarise((irrs[i] as Float64Array).subarray(0, irrCount)), definedDraws: irrCount },
          };
        }),
      };
    },
  };
  return run;
}

/**
 * Runs a whole Monte Carlo synchronously in chunks, reporting progress after each chunk and
 * stopping early when `isCancelled()` turns true. Same seed and settings → identical result.
 */
export function runMonteCarlo(scenario: Scenario, settings: MonteCarloSettings = scenario.risk.monteCarlo, options: MonteCarloRunOptions = {}): MonteCarloResult {
  const chunk = Math.max(1, Math.floor(options.chunkSize ?? DEFAULT_CHUNK));
  const run = createMonteCarloRun(scenario, settings, options);
  while (!run.finished()) {
    if (options.isCancelled?.()) {
      run.cancel();
      break;
    }
    run.step(chunk);
    options.onProgress?.(run.done(), run.total);
  }
  return run.result();
}
