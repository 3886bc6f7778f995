/**
 * The page's side of the Monte Carlo workers (src/composables/useMonteCarloWorker.ts) over
 * stand-in workers that answer with the real worker's responder: however many workers the
 * browser allows, the result is the shared core's sequential one exactly (docs/model.md, Risk:
 * the draws are seeded per block), progress climbs to the total, and Cancel keeps whole blocks.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { effectScope, watch } from 'vue';
import { MONTE_CARLO_BLOCK_DRAWS, runMonteCarlo, type MonteCarloSettings } from '../../../shared/engine/risk/monte-carlo';
import { useMonteCarloWorker } from '@/composables/useMonteCarloWorker';
import { createMonteCarloResponder } from '@/workers/monte-carlo-responder';
import type { MonteCarloWorkerMessage, MonteCarloWorkerRequest } from '@/workers/monte-carlo-protocol';
import { riskScenario } from '../engine/fixtures';

/** A worker in a macrotask of its own per message, copying messages both ways as postMessage does. */
class StandInWorker {
  static made: StandInWorker[] = [];
  onmessage: ((event: { data: MonteCarloWorkerMessage }) => void) | null = null;
  onerror: (() => void) | null = null;
  blocks = 0;
  private readonly respond = createMonteCarloResponder();
  constructor() {
    StandInWorker.made.push(this);
  }
  postMessage(request: MonteCarloWorkerRequest): void {
    const copy = structuredClone(request);
    setTimeout(() => {
      const message = this.respond(copy);
      if (message?.type === 'block') this.blocks += 1;
      if (message) this.onmessage?.({ data: structuredClone(message) });
    }, 0);
  }
  terminate(): void {}
}

const scenario = riskScenario();
// Five full blocks and a short sixth.
const settings: MonteCarloSettings = { ...scenario.risk.monteCarlo, draws: 5 * MONTE_CARLO_BLOCK_DRAWS + 50 };

function withCores(cores: number) {
  StandInWorker.made = [];
  vi.stubGlobal('Worker', StandInWorker);
  vi.stubGlobal('navigator', { hardwareConcurrency: cores });
  const scope = effectScope();
  const monteCarlo = scope.run(() => useMonteCarloWorker());
  if (!monteCarlo) throw new Error('no composable');
  return { monteCarlo, scope };
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('Monte Carlo on several workers', () => {
  it('gives the sequential result exactly on 1, 3 or 8 workers, spreading the blocks', async () => {
    const sequential = runMonteCarlo(scenario, settings);
    for (const [cores, workers] of [
      [1, 1],
      [3, 3],
      // Never more workers than blocks.
      [8, 6],
    ] as const) {
      const { monteCarlo, scope } = withCores(cores);
      const seen: number[] = [];
      scope.run(() => watch(monteCarlo.done, (done) => seen.push(done), { flush: 'sync' }));
      monteCarlo.start(scenario, settings);
      await vi.waitFor(() => expect(monteCarlo.running.value).toBe(false), { timeout: 20_000 });
      expect(monteCarlo.error.value).toBeNull();
      expect(monteCarlo.result.value).toEqual(sequential);
      expect(StandInWorker.made).toHaveLength(workers);
      expect(StandInWorker.made.every((worker) => worker.blocks > 0)).toBe(true);
      expect(seen).toEqual([...seen].sort((a, b) => a - b));
      expect(seen.at(-1)).toBe(settings.draws);
      scope.stop();
    }
  });

  it('on Cancel keeps the whole blocks done and says the run was cancelled', async () => {
    const { monteCarlo, scope } = withCores(2);
    scope.run(() =>
      watch(
        monteCarlo.done,
        (done) => {
          if (done > 0) monteCarlo.cancel();
        },
        { flush: 'sync' },
      ),
    );
    monteCarlo.start(scenario, settings);
    await vi.waitFor(() => expect(monteCarlo.running.value).toBe(false), { timeout: 20_000 });
    const result = monteCarlo.result.value;
    expect(result?.cancelled).toBe(true);
    expect(result?.drawsDone).toBe(MONTE_CARLO_BLOCK_DRAWS);
    expect(result?.drawsRequested).toBe(settings.draws);
    expect(result?.options[0]?.npv.histogram.reduce((n, bin) => n + bin.count, 0)).toBe(MONTE_CARLO_BLOCK_DRAWS);
    scope.stop();
  });
});
