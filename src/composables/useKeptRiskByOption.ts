/**
 * The kept Monte Carlo run's chance of loss per option, for the cards and the comparison: loaded
 * for the open scenario after each save (never run again here) and out of date while edits are unsaved.
 */
import { computed, watch } from 'vue';
import type { MonteCarloResult } from '@shared/engine';
import { cardRiskByOption } from '@/components/option-card-risk';
import { usePreferencesStore } from '@/stores/preferences';
import { useScenarioStore } from '@/stores/scenario';

export function useKeptRiskByOption() {
  const store = useScenarioStore();
  const prefs = usePreferencesStore();
  watch(
    () => [store.farmId, store.scenarioId, store.savedVersion] as const,
    ([f, s]) => {
      if (f !== null && s !== null) void prefs.loadRisk(f, s);
    },
    { immediate: true },
  );
  return computed(() => {
    const kept = prefs.savedRisk;
    return cardRiskByOption(kept ? (kept.result as MonteCarloResult) : null, Boolean(kept?.fresh) && !store.dirty);
  });
}
