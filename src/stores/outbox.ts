/** The dev outbox: captured e-mails, newest first. */
import { defineStore } from 'pinia';
import { readonly, ref } from 'vue';
import { outboxApi, type CapturedMail } from '@/api/outbox';

export const useOutboxStore = defineStore('dev-outbox', () => {
  const messages = ref<CapturedMail[]>([]);
  const loaded = ref(false);

  async function load(): Promise<void> {
    messages.value = (await outboxApi.list()).messages;
    loaded.value = true;
  }

  return { messages: readonly(messages), loaded: readonly(loaded), load };
});
