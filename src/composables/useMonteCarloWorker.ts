/**
 * Drives the Monte Carlo on Web Workers: start, progress, cancel, result. The draws come in fixed
 * blocks with their own seeded streams (shared/engine/risk/monte-carlo.ts), so the run is split
 * over one worker per core and gives the same result however many ran. Blocks go one at a time to
 * whichever worker is free; one worker merges them. The workers live as long as the component;
 * messages of an earlier run are ignored once a new one starts.
 */
import { onScopeDispose, readonly, ref, shallowRef } from 'vue';
import { monteCarloBlockCount, type MonteCarloResult, type MonteCarloSamples, type MonteCarloSettings } from '@shared/engine';
import type { Scenario } from '@shared/schema';
import { monteCarloWorkerCount, samplesBuffers, type MonteCarloWorkerMessage, type MonteCarloWorkerRequest } from '@/workers/monte-carlo-protocol';

interface ActiveRun {
  readonly id: number;
  readonly pool: Worker[];
  readonly blocks: number;
  nextBlock: number;
  readonly busy: Set<Worker>;
  readonly parts: MonteCarloSamples[];
  /** Set once the merge is asked for: blocks arriving later are not counted. */
  merging: boolean;
}

export function useMonteCarloWorker() {
  const running = ref(false);
  const done = ref(0);
  const total = ref(0);
  const result = shallowRef<MonteCarloResult | null>(null);
  const error = ref<string | null>(null);
  const workers: Worker[] = [];
  let runId = 0;
  let active: ActiveRun | null = null;

  const send = (worker: Worker, request: MonteCarloWorkerRequest, transfer: Transferable[] = []): void => worker.postMessage(request, transfer);

  function stop(message: string): void {
    error.value = message;
    running.value = false;
    active = null;
  }

  /** Gives the worker the next block, if any is left. */
  function handOut(run: ActiveRun, worker: Worker): void {
    if (run.nextBlock >= run.blocks) return;
    send(worker, { type: 'block', runId: run.id, block: run.nextBlock });
    run.nextBlock += 1;
    run.busy.add(worker);
  }

  /** Asks a free worker (else the first) to merge the blocks done; the run takes no more blocks. */
  function merge(run: ActiveRun, cancelled: boolean): void {
    run.merging = true;
    run.nextBlock = run.blocks;
    const worker = run.pool.find((w) => !run.busy.has(w)) ?? (run.pool[0] as Worker);
    send(worker, { type: 'merge', runId: run.id, parts: run.parts, cancelled }, samplesBuffers(run.parts));
  }

  function receive(worker: Worker, message: MonteCarloWorkerMessage): void {
    const run = active;
    if (!run || message.runId !== run.id) return;
    if (message.type === 'error') return stop(`The simulation stopped: ${message.message}`);
    if (message.type === 'done') {
      result.value = message.result;
      done.value = message.result.drawsDone;
      running.value = false;
      active = null;
      return;
    }
    run.busy.delete(worker);
    if (run.merging) return;
    run.parts.push(message.samples);
    done.value += message.samples.draws;
    handOut(run, worker);
    if (run.busy.size === 0) merge(run, false);
  }

  function ensureWorkers(count: number): Worker[] {
    while (workers.length < count) {
      const worker = new Worker(new URL('../workers/monte-carlo.worker.ts', import.meta.url), { type: 'module', name: `monte-carlo-${workers.length + 1}` });
      worker.onmessage = (event: MessageEvent<MonteCarloWorkerMessage>) => receive(worker, event.data);
      worker.onerror = () => {
        if (active) stop('The simulation could not start in this browser.');
      };
      workers.push(worker);
    }
    return workers.slice(0, count);
  }

  /** Starts a run on a plain copy of the scenario (reactive proxies cannot cross to a worker). */
  function start(scenario: Scenario, settings: MonteCarloSettings): void {
    runId += 1;
    error.value = null;
    result.value = null;
    done.value = 0;
    total.value = settings.draws;
    running.value = true;
    const blocks = monteCarloBlockCount(settings.draws);
    const pool = ensureWorkers(monteCarloWorkerCount(navigator.hardwareConcurrency, blocks));
    const run: ActiveRun = { id: runId, pool, blocks, nextBlock: 0, busy: new Set(), parts: [], merging: false };
    active = run;
    const prepare: MonteCarloWorkerRequest = {
      type: 'prepare',
      runId,
      scenario: JSON.parse(JSON.stringify(scenario)) as Scenario,
      settings: JSON.parse(JSON.stringify(settings)) as MonteCarloSettings,
    };
    for (const worker of pool) {
      send(worker, prepare);
      handOut(run, worker);
    }
    if (blocks === 0) merge(run, false);
  }

  /** Stops handing out blocks; the result holds the blocks done so far, marked cancelled. */
  function cancel(): void {
    if (!running.value || !active || active.merging) return;
    merge(active, true);
  }

  onScopeDispose(() => {
    for (const worker of workers) worker.terminate();
    workers.length = 0;
    active = null;
  });

  return { running: readonly(running), done: readonly(done), total: readonly(total), result, error: readonly(error), start, cancel };
}
