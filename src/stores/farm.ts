/** The farm being looked at: its details, its herd and market baseline, and its scenarios. */
import { defineStore } from 'pinia';
import { computed, readonly, ref } from 'vue';
import { baselineApi, type FarmBaseline } from '@/api/baseline';
import { farmsApi, type FarmDetail } from '@/api/farms';
import { messageFor } from '@/api/messages';
import { scenariosApi, type CreateScenarioBody, type ScenarioListItem } from '@/api/scenarios';
import type { DisplaySettings } from '@/composables/useFormat';
import { roleAllows, type Permission } from '@shared/permissions';
import type { Herd } from '@shared/schema';

export const useFarmStore = defineStore('farm', () => {
  const farmId = ref<number | null>(null);
  const farm = ref<FarmDetail | null>(null);
  const baseline = ref<FarmBaseline | null>(null);
  const scenarios = ref<ScenarioListItem[]>([]);
  const loadError = ref<string | null>(null);
  const loaded = ref(false);
  let pending: Promise<void> | null = null;

  /** The caller's role on this farm allows it (the server's own permission table); false before the farm loads. */
  function can(permission: Permission): boolean {
    return farm.value !== null && roleAllows(farm.value.role, permission);
  }
  const canEdit = computed(() => can('scenario:write'));
  const display = computed<DisplaySettings>(() => ({
    units: baseline.value?.units ?? farm.value?.units ?? 'metric',
    locale: baseline.value?.locale ?? farm.value?.locale ?? 'en-IE',
    currency: baseline.value?.currency ?? farm.value?.currency ?? 'EUR',
  }));

  /** Loads farm, baseline and scenario list; concurrent callers for the same farm share one request. */
  function load(id: number, force = false): Promise<void> {
    if (!force && farmId.value === id && loaded.value) return Promise.resolve();
    if (pending && farmId.value === id && !force) return pending;
    if (farmId.value !== id) {
      farm.value = null;
      baseline.value = null;
      scenarios.value = [];
      loaded.value = false;
    }
    farmId.value = id;
    loadError.value = null;
    // A lender is not shown the herd baseline (the API refuses it): ask only for what they may see.
    pending = farmsApi
      .get(id)
      .then((detail) => Promise.all([detail, roleAllows(detail.role, 'baseline:read') ? baselineApi.get(id) : null, scenariosApi.list(id)]))
      .then(([detail, base, list]) => {
        farm.value = detail;
        baseline.value = base;
        scenarios.value = list;
        loaded.value = true;
      })
      .catch((error: unknown) => {
        loadError.value = messageFor(error, 'Could not load this farm');
      })
      .finally(() => {
        pending = null;
      });
    return pending;
  }

  async function refreshScenarios(): Promise<void> {
    if (farmId.value === null) return;
    scenarios.value = await scenariosApi.list(farmId.value);
  }

  /** Saves the baseline; field errors come back as ApiError.fields for the form to show. */
  async function saveBaseline(next: FarmBaseline & { herd: Herd }): Promise<void> {
    if (farmId.value === null) return;
    baseline.value = await baselineApi.save(farmId.value, next);
  }

  /** Creates a scenario from the baseline; returns its id. */
  async function createScenario(body: CreateScenarioBody): Promise<number> {
    if (farmId.value === null) throw new Error('No farm loaded');
    const created = await scenariosApi.create(farmId.value, body);
    await refreshScenarios();
    return created.id;
  }

  function requireFarm(): number {
    if (farmId.value === null) throw new Error('farm store used before load');
    return farmId.value;
  }

  /** Copies a scenario (as its latest version); returns the copy's name. */
  async function duplicateScenario(id: number): Promise<string> {
    const copy = await scenariosApi.duplicate(requireFarm(), id);
    await refreshScenarios();
    return copy.scenario.name;
  }

  /** Puts a scenario aside: it leaves the working list but keeps every version. */
  async function archiveScenario(id: number): Promise<void> {
    await scenariosApi.archive(requireFarm(), id);
    await refreshScenarios();
  }

  /** Deletes a scenario with all its versions, for everyone on the farm. */
  async function removeScenario(id: number): Promise<void> {
    await scenariosApi.remove(requireFarm(), id);
    await refreshScenarios();
  }

  /** Where a scenario's document downloads as a JSON file. */
  function exportUrl(id: number): string {
    return scenariosApi.exportUrl(requireFarm(), id);
  }

  return {
    farmId: readonly(farmId),
    farm: readonly(farm),
    baseline: computed(() => baseline.value),
    scenarios: readonly(scenarios),
    loadError: readonly(loadError),
    loaded: readonly(loaded),
    can,
    canEdit,
    display,
    load,
    refreshScenarios,
    saveBaseline,
    createScenario,
    duplicateScenario,
    archiveScenario,
    removeScenario,
    exportUrl,
  };
});
