/**
 * The documents on screen: a farm's, or one scenario's or capital line's (the target), with the
 * quote amounts behind each capital line of a scenario; upload with progress, quote amounts, delete.
 */
import { defineStore } from 'pinia';
import { computed, readonly, ref, shallowRef } from 'vue';
import { messageFor } from '@/api/messages';
import { documentsApi, type CapitalLineQuotes, type DocumentTarget, type DocumentView } from '@/api/documents';

const sameTarget = (a: DocumentTarget, b: DocumentTarget) => a.scenarioId === b.scenarioId && a.capitalLineId === b.capitalLineId;

export const useDocumentsStore = defineStore('documents', () => {
  const place = shallowRef<{ farmId: number; target: DocumentTarget } | null>(null);
  const documents = shallowRef<DocumentView[]>([]);
  const quotes = shallowRef<CapitalLineQuotes[]>([]);
  const loadError = ref<string | null>(null);
  /** The file being uploaded and how much of it has been sent, in percent. */
  const uploading = ref<{ name: string; percent: number } | null>(null);

  function requirePlace(): { farmId: number; target: DocumentTarget } {
    if (!place.value) throw new Error('documents store used before load');
    return place.value;
  }

  function isCurrent(farmId: number, target: DocumentTarget): boolean {
    return place.value !== null && place.value.farmId === farmId && sameTarget(place.value.target, target);
  }

  /** Loads the documents of `target` (and its scenario's quotes); an answer for an earlier target is dropped. */
  async function load(farmId: number, target: DocumentTarget = {}): Promise<void> {
    if (!isCurrent(farmId, target)) {
      documents.value = [];
      quotes.value = [];
    }
    place.value = { farmId, target };
    try {
      const [list, lineQuotes] = await Promise.all([
        documentsApi.list(farmId, target),
        target.scenarioId !== undefined ? documentsApi.quotes(farmId, target.scenarioId).then((q) => q.lines) : Promise.resolve([]),
      ]);
      if (!isCurrent(farmId, target)) return;
      documents.value = list;
      quotes.value = lineQuotes;
      loadError.value = null;
    } catch (error) {
      if (isCurrent(farmId, target)) loadError.value = messageFor(error, 'Could not load the documents');
    }
  }

  function reload(): Promise<void> {
    const { farmId, target } = requirePlace();
    return load(farmId, target);
  }

  /** Uploads `file` to the current target, then reloads the list. */
  async function upload(file: File): Promise<void> {
    const { farmId, target } = requirePlace();
    uploading.value = { name: file.name, percent: 0 };
    try {
      await documentsApi.upload(farmId, file, target, (sent, total) => {
        if (uploading.value) uploading.value.percent = Math.round((sent / total) * 100);
      });
    } finally {
      uploading.value = null;
    }
    await reload();
  }

  /** Sets (or clears, with null) the quote amount of a capital-line document; the line quotes follow. */
  async function setQuoteAmount(id: number, amount: number | null): Promise<void> {
    const { farmId, target } = requirePlace();
    const updated = await documentsApi.setQuoteAmount(farmId, id, amount);
    documents.value = documents.value.map((d) => (d.id === id ? updated : d));
    if (target.scenarioId !== undefined) quotes.value = (await documentsApi.quotes(farmId, target.scenarioId)).lines;
  }

  async function remove(id: number): Promise<void> {
    const { farmId } = requirePlace();
    await documentsApi.remove(farmId, id);
    await reload();
  }

  /** Where the browser downloads a document of the current farm. */
  function downloadUrl(id: number): string {
    return documentsApi.downloadUrl(requirePlace().farmId, id);
  }

  return {
    documents: computed(() => documents.value),
    quotes: computed(() => quotes.value),
    loadError: readonly(loadError),
    uploading: readonly(uploading),
    load,
    upload,
    setQuoteAmount,
    remove,
    downloadUrl,
  };
});
