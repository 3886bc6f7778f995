/** Lender shares and reviews of the scenario or farm being looked at, and the lender's own shares. */
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { CreateNoteInput, CreateShareInput, ReviewStatusValue } from '@shared/schema/lender';
import { lenderApi, type LenderShare } from '@/api/lender';
import { reviewsApi, type ShareReview } from '@/api/reviews';
import { scenariosApi, type VersionListItem } from '@/api/scenarios';

export const useLenderStore = defineStore('lender', () => {
  const shares = ref<LenderShare[]>([]);
  const reviews = ref<ShareReview[]>([]);
  const mine = ref<LenderShare[]>([]);
  const versions = ref<VersionListItem[]>([]);
  let place: { farmId: number; scenarioId: number; canShare: boolean } | null = null;

  /** Loads the reviews of a scenario and, for those who may share, its shares and saved versions. */
  async function loadScenario(farmId: number, scenarioId: number, canShare: boolean): Promise<void> {
    place = { farmId, scenarioId, canShare };
    const [r, s, v] = await Promise.all([
      reviewsApi.ofScenario(farmId, scenarioId),
      canShare ? lenderApi.list(farmId, scenarioId) : Promise.resolve([]),
      canShare ? scenariosApi.versions(farmId, scenarioId) : Promise.resolve([]),
    ]);
    reviews.value = r;
    shares.value = s;
    versions.value = v;
  }

  async function reload(): Promise<void> {
    if (place) await loadScenario(place.farmId, place.scenarioId, place.canShare);
  }

  /** The calling lender's live shares on a farm. */
  async function loadMine(farmId: number): Promise<LenderShare[]> {
    mine.value = await lenderApi.mine(farmId);
    return mine.value;
  }

  async function share(farmId: number, scenarioId: number, body: CreateShareInput): Promise<LenderShare> {
    const created = await lenderApi.create(farmId, scenarioId, body);
    await reload();
    return created;
  }

  async function revoke(farmId: number, shareId: number): Promise<void> {
    await lenderApi.revoke(farmId, shareId);
    await reload();
  }

  async function addNote(farmId: number, shareId: number, body: CreateNoteInput): Promise<void> {
    await reviewsApi.addNote(farmId, shareId, body);
    await reload();
  }

  async function reply(farmId: number, shareId: number, noteId: number, body: string): Promise<void> {
    await reviewsApi.reply(farmId, shareId, noteId, body);
    await reload();
  }

  /** Where the lender workbook of a scenario downloads (members: latest version; a lender: the shared one). */
  function workbookUrl(farmId: number, scenarioId: number): string {
    return lenderApi.workbookUrl(farmId, scenarioId);
  }

  async function setStatus(farmId: number, shareId: number, status: ReviewStatusValue): Promise<void> {
    await reviewsApi.setStatus(farmId, shareId, status);
    await reload();
  }

  return {
    shares: computed(() => shares.value),
    reviews: computed(() => reviews.value),
    mine: computed(() => mine.value),
    versions: computed(() => versions.value),
    loadScenario,
    loadMine,
    share,
    revoke,
    addNote,
    reply,
    setStatus,
    workbookUrl,
  };
});
