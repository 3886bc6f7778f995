/// <reference lib="webworker" />
/**
 * Runs the shared Monte Carlo core off the main thread. Work is sliced: a slice of draws, then a
 * progress message, then a macrotask break so a 'cancel' message is read between slices. The
 * result is the core's own, so the same seed gives the same numbers here as on the server.
 */
import { createMonteCarloRun, type MonteCarloRun } from '@shared/engine';
import type { MonteCarloWorkerRequest, MonteCarloWorkerMessage } from './monte-carlo-protocol';

declare const self: DedicatedWorkerGlobalScope;

/** Longest stretch of draws between progress messages (ms). */
const SLICE_MS = 100;
/** Draws between clock checks inside a slice. */
const STEP = 10;

let active: { runId: number; run: MonteCarloRun } | null = null;

function post(message: MonteCarloWorkerMessage): void {
  self.postMessage(message);
}

function finish(runId: number, run: MonteCarloRun): void {
  post({ type: 'done', runId, result: run.result() });
  if (active?.runId === runId) active = null;
}

function slice(runId: number): void {
  const current = active;
  if (!current || current.runId !== runId) return;
  const { run } = current;
  try {
    const started = performance.now();
    while (!run.finished() && performance.now() - started < SLICE_MS) run.step(STEP);
    post({ type: 'progress', runId, done: run.done(), total: run.total });
    if (run.finished()) finish(runId, run);
    else setTimeout(() => slice(runId), 0);
  } catch (error) {
    active = null;
    post({ type: 'error', runId, message: error instanceof Error ? error.message : String(error) });
  }
}

self.onmessage = (event: MessageEvent<MonteCarloWorkerRequest>) => {
  const request = event.data;
  if (request.type === 'start') {
    try {
      active = { runId: request.runId, run: createMonteCarloRun(request.scenario, request.settings) };
      post({ type: 'progress', runId: request.runId, done: 0, total: active.run.total });
      setTimeout(() => slice(request.runId), 0);
    } catch (error) {
      post({ type: 'error', runId: request.runId, message: error instanceof Error ? error.message : String(error) });
    }
  } else if (request.type === 'cancel' && active?.runId === request.runId) {
    active.run.cancel();
    finish(request.runId, active.run);
  }
};
