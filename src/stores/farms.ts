/** The farms the signed-in person belongs to (a consultant sees every client farm here). */
import { defineStore } from 'pinia';
import { readonly, ref } from 'vue';
import { farmsApi, type FarmSummary } from '@/api/farms';
import type { CreateFarmInput } from '@shared/schema/accounts';

export const useFarmListStore = defineStore('farm-list', () => {
  const farms = ref<FarmSummary[]>([]);
  const loaded = ref(false);
  let pending: Promise<void> | null = null;

  /** Loads the list; concurrent callers share one request. */
  function load(): Promise<void> {
    pending ??= farmsApi
      .list()
      .then((list) => {
        farms.value = list;
        loaded.value = true;
      })
      .finally(() => {
        pending = null;
      });
    return pending;
  }

  /** Creates a farm with the caller as its owner; returns its id. */
  async function create(input: CreateFarmInput): Promise<number> {
    const created = await farmsApi.create(input);
    await load();
    return created.id;
  }

  return { farms: readonly(farms), loaded: readonly(loaded), load, create };
});
