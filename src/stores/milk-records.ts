/**
 * The milk-record import of one farm: the herd fields as the baseline holds them and past imports,
 * then an upload read into a preview and the confirmation that sets the herd baseline.
 */
import { defineStore } from 'pinia';
import { computed, readonly, ref, shallowRef } from 'vue';
import { messageFor } from '@/api/messages';
import { milkRecordsApi, type MilkRecordHistory, type MilkRecordImport, type MilkRecordPreview } from '@/api/milk-records';
import { useFarmStore } from './farm';

export const useMilkRecordsStore = defineStore('milk-records', () => {
  const farmId = ref<number | null>(null);
  const history = shallowRef<MilkRecordHistory | null>(null);
  const historyError = ref<string | null>(null);
  const preview = shallowRef<MilkRecordPreview | null>(null);
  const confirmed = shallowRef<MilkRecordImport | null>(null);
  /** Percent of the file sent while an upload runs, else null. */
  const uploadPercent = ref<number | null>(null);

  function requireFarm(): number {
    if (farmId.value === null) throw new Error('milk-records store used before load');
    return farmId.value;
  }

  /** Loads a farm's history and starts its import afresh. */
  async function load(id: number): Promise<void> {
    if (farmId.value !== id) history.value = null;
    farmId.value = id;
    restart();
    await loadHistory();
  }

  async function loadHistory(): Promise<void> {
    const id = requireFarm();
    historyError.value = null;
    try {
      const answer = await milkRecordsApi.history(id);
      if (farmId.value === id) history.value = answer;
    } catch (error) {
      if (farmId.value === id) historyError.value = messageFor(error, 'Could not load the milk-record imports');
    }
  }

  /** Sends a file to be read; what was read (and refused) becomes the preview. */
  async function read(file: File): Promise<void> {
    const id = requireFarm();
    uploadPercent.value = 0;
    try {
      preview.value = await milkRecordsApi.preview(id, file, (sent, total) => (uploadPercent.value = Math.round((sent / total) * 100)));
    } finally {
      uploadPercent.value = null;
    }
  }

  /** Confirms the preview into the herd baseline; the history and the farm's baseline are read again. */
  async function confirm(): Promise<MilkRecordImport> {
    const id = requireFarm();
    if (!preview.value) throw new Error('nothing to confirm');
    const record = await milkRecordsApi.confirm(id, preview.value.token);
    confirmed.value = record;
    await Promise.all([loadHistory(), useFarmStore().load(id, true)]);
    return record;
  }

  /** Back to the upload step. */
  function restart(): void {
    preview.value = null;
    confirmed.value = null;
    uploadPercent.value = null;
  }

  return {
    history: computed(() => history.value),
    historyError: readonly(historyError),
    preview: computed(() => preview.value),
    confirmed: computed(() => confirmed.value),
    uploadPercent: readonly(uploadPercent),
    load,
    read,
    confirm,
    restart,
  };
});
