/**
 * Preferences and the decision on the open scenario, and its saved Monte Carlo result: loaded
 * once per scenario, changed through named actions.
 */
import { defineStore } from 'pinia';
import { readonly, ref } from 'vue';
import { messageFor } from '@/api/messages';
import type { MonteCarloResult } from '@shared/engine';
import { preferencesApi, type PreferencesView, type SavedRiskResult } from '@/api/preferences';

export const usePreferencesStore = defineStore('preferences', () => {
  const key = ref<string | null>(null);
  const view = ref<PreferencesView | null>(null);
  const error = ref<string | null>(null);
  const busy = ref(false);
  let pending: Promise<void> | null = null;
  let ids: { farmId: number; scenarioId: number } | null = null;
  const savedRisk = ref<SavedRiskResult | null>(null);
  const riskKey = ref<string | null>(null);

  /** Loads the scenario's preferences; concurrent callers for the same scenario share one request. */
  function load(farmId: number, scenarioId: number, force = false): Promise<void> {
    const next = `${farmId}/${scenarioId}`;
    if (!force && key.value === next && view.value) return Promise.resolve();
    if (pending && key.value === next) return pending;
    if (key.value !== next) view.value = null;
    key.value = next;
    ids = { farmId, scenarioId };
    error.value = null;
    pending = preferencesApi
      .get(farmId, scenarioId)
      .then((loaded) => {
        view.value = loaded;
      })
      .catch((e: unknown) => {
        error.value = messageFor(e, 'Could not load the preferences');
      })
      .finally(() => {
        pending = null;
      });
    return pending;
  }

  async function run(action: (farmId: number, scenarioId: number) => Promise<PreferencesView>): Promise<boolean> {
    if (!ids) return false;
    busy.value = true;
    error.value = null;
    try {
      view.value = await action(ids.farmId, ids.scenarioId);
      return true;
    } catch (e) {
      error.value = messageFor(e, 'That did not work. Try again.');
      return false;
    } finally {
      busy.value = false;
    }
  }

  /** Loads the saved Monte Carlo result (none → null). */
  async function loadRisk(farmId: number, scenarioId: number): Promise<void> {
    const next = `${farmId}/${scenarioId}`;
    if (riskKey.value !== next) savedRisk.value = null;
    riskKey.value = next;
    try {
      savedRisk.value = await preferencesApi.riskResult(farmId, scenarioId);
    } catch (e) {
      error.value = messageFor(e, 'Could not load the saved risk result');
      savedRisk.value = null;
    }
  }

  /** Keeps a finished run as the scenario's saved result; false (with a message) when the server refuses. */
  async function keepRisk(farmId: number, scenarioId: number, scenarioVersion: number, result: MonteCarloResult): Promise<boolean> {
    try {
      savedRisk.value = await preferencesApi.keepRiskResult(farmId, scenarioId, { scenarioVersion, result });
      riskKey.value = `${farmId}/${scenarioId}`;
      return true;
    } catch (e) {
      error.value = messageFor(e, 'Could not keep the risk result');
      return false;
    }
  }

  return {
    view: readonly(view),
    savedRisk: readonly(savedRisk),
    loadRisk,
    keepRisk,
    error: readonly(error),
    busy: readonly(busy),
    load,
    record: (optionId: string, reason: string) => run((f, s) => preferencesApi.record(f, s, { optionId, reason })),
    withdraw: () => run((f, s) => preferencesApi.withdraw(f, s)),
    decide: (optionId: string, note: string) => run((f, s) => preferencesApi.decide(f, s, { optionId, note })),
  };
});
