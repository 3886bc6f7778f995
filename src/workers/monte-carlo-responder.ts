/**
 * What a Monte Carlo worker does with each request, apart from the worker's message plumbing:
 * prepares a run, runs one block of it, or merges blocks into the result.
 */
import { mergeMonteCarloSamples, prepareMonteCarlo, runMonteCarloBlocks, type PreparedMonteCarlo } from '@shared/engine';
import type { MonteCarloWorkerMessage, MonteCarloWorkerRequest } from './monte-carlo-protocol';

/** A responder holding one prepared run; it answers a request with a message, or null when none is due. */
export function createMonteCarloResponder(): (request: MonteCarloWorkerRequest) => MonteCarloWorkerMessage | null {
  let active: { runId: number; prepared: PreparedMonteCarlo } | null = null;

  function answer(request: MonteCarloWorkerRequest): MonteCarloWorkerMessage | null {
    if (request.type === 'prepare') {
      // Cleared first: a run that fails to prepare leaves no earlier run to answer for it.
      active = null;
      active = { runId: request.runId, prepared: prepareMonteCarlo(request.scenario, request.settings) };
      return null;
    }
    // A request of an earlier run, or of a run this worker could not prepare, is dropped.
    if (active?.runId !== request.runId) return null;
    if (request.type === 'block') {
      return { type: 'block', runId: request.runId, block: request.block, samples: runMonteCarloBlocks(active.prepared, request.block, request.block + 1) };
    }
    return { type: 'done', runId: request.runId, result: mergeMonteCarloSamples(active.prepared, request.parts, { cancelled: request.cancelled }) };
  }

  return (request) => {
    try {
      return answer(request);
    } catch (error) {
      return { type: 'error', runId: request.runId, message: error instanceof Error ? error.message : String(error) };
    }
  };
}
