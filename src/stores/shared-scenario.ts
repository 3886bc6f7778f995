/**
 * What a lender reads of one shared scenario: the shared version with its results, the Monte
 * Carlo run the farm kept on it (the server withholds a run on inputs not shared) and the quotes
 * and documents on its capital lines. Read-only: nothing here writes.
 */
import { defineStore } from 'pinia';
import { readonly, ref, shallowRef } from 'vue';
import { ApiError } from '@/api/client';
import { messageFor } from '@/api/messages';
import { documentsApi, type CapitalLineQuotes } from '@/api/documents';
import { lenderApi, type LenderShare } from '@/api/lender';
import { preferencesApi, type SavedRiskResult } from '@/api/preferences';
import { scenariosApi, type ScenarioDocument } from '@/api/scenarios';

export const useSharedScenarioStore = defineStore('shared-scenario', () => {
  const doc = shallowRef<ScenarioDocument | null>(null);
  const risk = shallowRef<SavedRiskResult | null>(null);
  const quotes = shallowRef<ReadonlyMap<string, CapitalLineQuotes>>(new Map());
  const error = ref<string | null>(null);
  let loading: string | null = null;

  /** Loads the scenario as shared with the caller; a 404 means not shared (or the share ended). */
  async function load(farmId: number, scenarioId: number): Promise<void> {
    const key = `${farmId}/${scenarioId}`;
    loading = key;
    doc.value = null;
    risk.value = null;
    quotes.value = new Map();
    error.value = null;
    try {
      const [loaded, saved, lines] = await Promise.all([
        scenariosApi.get(farmId, scenarioId),
        // A missing run or quotes list leaves the rest readable: the screen says "not run yet" or "estimate".
        preferencesApi.riskResult(farmId, scenarioId).catch(() => null),
        documentsApi.quotes(farmId, scenarioId).then((q) => q.lines).catch(() => []),
      ]);
      if (loading !== key) return;
      doc.value = loaded;
      risk.value = saved?.fresh ? saved : null;
      quotes.value = new Map(lines.map((l) => [l.capitalLineId, l]));
    } catch (e) {
      if (loading !== key) return;
      error.value = e instanceof ApiError && e.status === 404 ? 'This scenario is not shared with you, or the share has ended.' : messageFor(e, 'Could not load the shared scenario.');
    }
  }

  /** The newest live share to the caller over the farms where they are a lender; null when none. */
  async function newestShare(farmIds: readonly number[]): Promise<{ farmId: number; scenarioId: number } | null> {
    const lists = await Promise.all(
      farmIds.map((farmId) =>
        lenderApi
          .mine(farmId)
          .then((shares) => shares.map((share) => ({ farmId, share })))
          .catch(() => [] as { farmId: number; share: LenderShare }[]),
      ),
    );
    const newest = lists.flat().sort((a, b) => (a.share.createdAt < b.share.createdAt ? 1 : a.share.createdAt > b.share.createdAt ? -1 : b.share.id - a.share.id))[0];
    return newest ? { farmId: newest.farmId, scenarioId: newest.share.scenarioId } : null;
  }

  /** Where a document on a shared capital line downloads. */
  function documentUrl(farmId: number, documentId: number): string {
    return documentsApi.downloadUrl(farmId, documentId);
  }

  function clear(): void {
    loading = null;
    doc.value = null;
    risk.value = null;
    quotes.value = new Map();
    error.value = null;
  }

  return { doc, risk, quotes, error: readonly(error), load, clear, newestShare, documentUrl };
});
