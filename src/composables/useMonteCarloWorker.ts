/**
 * Drives the Monte Carlo Web Worker: start, progress, cancel, result. One worker per component,
 * ended when the component goes; messages of an earlier run are ignored once a new one starts.
 */
import { onScopeDispose, readonly, ref, shallowRef } from 'vue';
import type { MonteCarloResult, MonteCarloSettings } from '@shared/engine';
import type { Scenario } from '@shared/schema';
import type { MonteCarloWorkerMessage, MonteCarloWorkerRequest } from '@/workers/monte-carlo-protocol';

export function useMonteCarloWorker() {
  const running = ref(false);
  const done = ref(0);
  const total = ref(0);
  const result = shallowRef<MonteCarloResult | null>(null);
  const error = ref<string | null>(null);
  let worker: Worker | null = null;
  let runId = 0;

  function ensureWorker(): Worker {
    if (worker) return worker;
    worker = new Worker(new URL('../workers/monte-carlo.worker.ts', import.meta.url), { type: 'module', name: 'monte-carlo' });
    worker.onmessage = (event: MessageEvent<MonteCarloWorkerMessage>) => {
      const message = event.data;
      if (message.runId !== runId) return;
      if (message.type === 'progress') {
        done.value = message.done;
        total.value = message.total;
      } else if (message.type === 'done') {
        result.value = message.result;
        done.value = message.result.drawsDone;
        running.value = false;
      } else {
        error.value = `The simulation stopped: ${message.message}`;
        running.value = false;
      }
    };
    worker.onerror = () => {
      error.value = 'The simulation could not start in this browser.';
      running.value = false;
    };
    return worker;
  }

  /** Starts a run on a plain copy of the scenario (reactive proxies cannot cross to a worker). */
  function start(scenario: Scenario, settings: MonteCarloSettings): void {
    runId += 1;
    error.value = null;
    result.value = null;
    done.value = 0;
    total.value = settings.draws;
    running.value = true;
    const plain = JSON.parse(JSON.stringify(scenario)) as Scenario;
    const request: MonteCarloWorkerRequest = { type: 'start', runId, scenario: plain, settings: JSON.parse(JSON.stringify(settings)) as MonteCarloSettings };
    ensureWorker().postMessage(request);
  }

  /** Asks the worker to stop; it answers with the draws done so far, marked cancelled. */
  function cancel(): void {
    if (!running.value || !worker) return;
    const request: MonteCarloWorkerRequest = { type: 'cancel', runId };
    worker.postMessage(request);
  }

  onScopeDispose(() => {
    worker?.terminate();
    worker = null;
  });

  return { running: readonly(running), done: readonly(done), total: readonly(total), result, error: readonly(error), start, cancel };
}
