/**
 * Messages between the page and its Monte Carlo workers; every message carries the run it
 * belongs to. The page prepares every worker for a run, hands out blocks one at a time to
 * whichever worker is free, and has one worker merge the blocks' raw outcomes into the result.
 */
import type { MonteCarloResult, MonteCarloSamples, MonteCarloSettings } from '@shared/engine';
import type { Scenario } from '@shared/schema';

export type MonteCarloWorkerRequest =
  | { type: 'prepare'; runId: number; scenario: Scenario; settings: MonteCarloSettings }
  | { type: 'block'; runId: number; block: number }
  | { type: 'merge'; runId: number; parts: MonteCarloSamples[]; cancelled: boolean };

export type MonteCarloWorkerMessage =
  | { type: 'block'; runId: number; block: number; samples: MonteCarloSamples }
  | { type: 'done'; runId: number; result: MonteCarloResult }
  | { type: 'error'; runId: number; message: string };

/** More workers than this gain little: each holds its own copy of the engine and scenario. */
const MAX_WORKERS = 8;

/** Workers for a run: one per core the browser reports, at most MAX_WORKERS, never more than the blocks, at least one. */
export function monteCarloWorkerCount(hardwareConcurrency: number | undefined, blocks: number): number {
  const cores = Number.isInteger(hardwareConcurrency) && (hardwareConcurrency ?? 0) > 0 ? (hardwareConcurrency as number) : 1;
  return Math.max(1, Math.min(cores, MAX_WORKERS, blocks));
}

/** The buffers of some samples, moved rather than copied when posted. */
export function samplesBuffers(parts: readonly MonteCarloSamples[]): ArrayBuffer[] {
  return parts.flatMap((part) => part.options.flatMap((o) => [o.npv.buffer, o.incrementalNpv.buffer, o.irr.buffer] as ArrayBuffer[]));
}
