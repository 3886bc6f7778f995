/// <reference lib="webworker" />
/**
 * Runs blocks of the shared Monte Carlo core off the main thread, one block per message, and
 * merges blocks into the result when asked. Each block draws from its own seeded stream, so the
 * result is the shared core's own whatever the number of workers: the same numbers as the server.
 */
import { mergeMonteCarloSamples, prepareMonteCarlo, runMonteCarloBlocks, type PreparedMonteCarlo } from '@shared/engine';
import { samplesBuffers, type MonteCarloWorkerMessage, type MonteCarloWorkerRequest } from './monte-carlo-protocol';

declare const self: DedicatedWorkerGlobalScope;

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

self.onmessage = (event: MessageEvent<MonteCarloWorkerRequest>) => {
  const request = event.data;
  try {
    const message = answer(request);
    if (message) self.postMessage(message, message.type === 'block' ? samplesBuffers([message.samples]) : []);
  } catch (error) {
    self.postMessage({ type: 'error', runId: request.runId, message: error instanceof Error ? error.message : String(error) } satisfies MonteCarloWorkerMessage);
  }
};
