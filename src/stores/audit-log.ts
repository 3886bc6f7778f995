/** The farm's audit log for the owner, newest first, one page of entries at a time. */
import { defineStore } from 'pinia';
import { computed, readonly, ref, shallowRef } from 'vue';
import { messageFor } from '@/api/messages';
import { lenderApi, type AuditEntry } from '@/api/lender';

export const useAuditLogStore = defineStore('audit-log', () => {
  const farmId = ref<number | null>(null);
  const entries = shallowRef<AuditEntry[]>([]);
  const nextBefore = ref<number | null>(null);
  const error = ref<string | null>(null);

  async function page(id: number, before?: number): Promise<void> {
    try {
      const answer = await lenderApi.auditLog(id, before);
      // An answer for a farm no longer on screen is dropped.
      if (farmId.value !== id) return;
      entries.value = before === undefined ? answer.entries : [...entries.value, ...answer.entries];
      nextBefore.value = answer.nextBefore;
    } catch (e) {
      if (farmId.value === id) error.value = messageFor(e, 'Could not load the lender activity.');
    }
  }

  /** The newest page of a farm's log. */
  function load(id: number): Promise<void> {
    farmId.value = id;
    entries.value = [];
    nextBefore.value = null;
    error.value = null;
    return page(id);
  }

  /** The next older page, after the entries already shown. */
  function loadMore(): Promise<void> {
    if (farmId.value === null || nextBefore.value === null) return Promise.resolve();
    error.value = null;
    return page(farmId.value, nextBefore.value);
  }

  return {
    entries: computed(() => entries.value),
    hasMore: computed(() => nextBefore.value !== null),
    error: readonly(error),
    load,
    loadMore,
  };
});
