/**
 * The yearly lines and loan payments of a scenario version, fetched from the server only when a
 * yearly or loan table is shown (the scenario read leaves them out). A version never changes,
 * so what was fetched is kept for the session.
 */
import { defineStore } from 'pinia';
import { shallowRef } from 'vue';
import type { OptionDetail } from '@shared/engine';
import { messageFor } from '@/api/messages';
import { scenariosApi } from '@/api/scenarios';

const keyOf = (farmId: number, scenarioId: number, version: number): string => `${farmId}/${scenarioId}/${version}`;

export const useResultsDetailStore = defineStore('results-detail', () => {
  const byVersion = shallowRef<ReadonlyMap<string, ReadonlyMap<string, OptionDetail>>>(new Map());
  const errors = shallowRef<ReadonlyMap<string, string>>(new Map());
  const pending = new Map<string, Promise<void>>();

  /** Fetches the detail of one version once; later calls for it return at once. */
  function load(farmId: number, scenarioId: number, version: number): Promise<void> {
    const key = keyOf(farmId, scenarioId, version);
    if (byVersion.value.has(key)) return Promise.resolve();
    const running = pending.get(key);
    if (running) return running;
    const started = scenariosApi
      .resultsDetail(farmId, scenarioId, version)
      .then((detail) => {
        byVersion.value = new Map(byVersion.value).set(key, new Map(detail.options.map((o) => [o.id, o])));
      })
      .catch((error: unknown) => {
        errors.value = new Map(errors.value).set(key, messageFor(error, 'Could not load the yearly figures.'));
      })
      .finally(() => pending.delete(key));
    pending.set(key, started);
    return started;
  }

  /** One option's detail, once loaded; null before. */
  function optionDetail(farmId: number, scenarioId: number, version: number, optionId: string): OptionDetail | null {
    return byVersion.value.get(keyOf(farmId, scenarioId, version))?.get(optionId) ?? null;
  }

  function errorOf(farmId: number, scenarioId: number, version: number): string | null {
    return errors.value.get(keyOf(farmId, scenarioId, version)) ?? null;
  }

  return { load, optionDetail, errorOf };
});
