/**
 * The saved versions of one scenario: the list (newest first), one version opened read-only, a
 * comparison of two, and restoring one as a new version. A saved version never changes, so what
 * was read of it is kept while the same scenario is open.
 */
import { defineStore } from 'pinia';
import { computed, readonly, ref, shallowRef } from 'vue';
import { messageFor } from '@/api/messages';
import { scenariosApi, type VersionComparison, type VersionDocument, type VersionListItem } from '@/api/scenarios';

/** Two versions side by side: what changed, and both documents to show the values. */
export interface VersionPair {
  changes: VersionComparison;
  older: VersionDocument;
  newer: VersionDocument;
}

export const useVersionsStore = defineStore('versions', () => {
  const place = ref<{ farmId: number; scenarioId: number } | null>(null);
  const versions = shallowRef<VersionListItem[]>([]);
  const viewing = shallowRef<VersionDocument | null>(null);
  const comparison = shallowRef<VersionPair | null>(null);
  const loadError = ref<string | null>(null);
  const documents = new Map<number, Promise<VersionDocument>>();

  const latestVersion = computed(() => versions.value[0]?.version ?? 0);

  function requirePlace(): { farmId: number; scenarioId: number } {
    if (!place.value) throw new Error('versions store used before load');
    return place.value;
  }

  /** One version's document, asked for once per open scenario (a failed read is asked again). */
  function documentOf(version: number): Promise<VersionDocument> {
    const { farmId, scenarioId } = requirePlace();
    let found = documents.get(version);
    if (!found) {
      found = scenariosApi.version(farmId, scenarioId, version);
      found.catch(() => documents.delete(version));
      documents.set(version, found);
    }
    return found;
  }

  /** Loads the list of a scenario's versions; opening another scenario forgets what was open. */
  async function load(farmId: number, scenarioId: number): Promise<void> {
    const same = place.value?.farmId === farmId && place.value.scenarioId === scenarioId;
    if (!same) {
      documents.clear();
      viewing.value = null;
      comparison.value = null;
      versions.value = [];
    }
    place.value = { farmId, scenarioId };
    loadError.value = null;
    try {
      const list = await scenariosApi.versions(farmId, scenarioId);
      if (place.value.farmId !== farmId || place.value.scenarioId !== scenarioId) return;
      versions.value = [...list].sort((a, b) => b.version - a.version);
    } catch (error) {
      loadError.value = messageFor(error, 'Could not load the versions');
    }
  }

  /** Opens one version read-only (and closes a comparison). */
  async function view(version: number): Promise<void> {
    viewing.value = await documentOf(version);
    comparison.value = null;
  }

  /** Compares two versions, the older first whichever order they are given in. */
  async function compare(a: number, b: number): Promise<void> {
    const { farmId, scenarioId } = requirePlace();
    const [from, to] = [Math.min(a, b), Math.max(a, b)];
    const [changes, older, newer] = await Promise.all([scenariosApi.compare(farmId, scenarioId, from, to), documentOf(from), documentOf(to)]);
    comparison.value = { changes, older, newer };
    viewing.value = null;
  }

  /** Saves `version` again as the newest version; returns the new version's number. */
  async function restore(version: number): Promise<number> {
    const { farmId, scenarioId } = requirePlace();
    const restored = await scenariosApi.restore(farmId, scenarioId, version);
    await load(farmId, scenarioId);
    return restored.version;
  }

  return {
    versions: computed(() => versions.value),
    viewing: computed(() => viewing.value),
    comparison: computed(() => comparison.value),
    loadError: readonly(loadError),
    latestVersion,
    load,
    view,
    compare,
    restore,
  };
});
