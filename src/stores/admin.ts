/** Every account, for the administrator's users screen. */
import { defineStore } from 'pinia';
import { readonly, ref } from 'vue';
import { adminApi, type AccountListing } from '@/api/admin';

export const useAdminUsersStore = defineStore('admin-users', () => {
  const users = ref<AccountListing[]>([]);
  const loaded = ref(false);

  async function load(): Promise<void> {
    users.value = await adminApi.users();
    loaded.value = true;
  }

  async function setDisabled(userId: number, disabled: boolean): Promise<void> {
    const updated = await adminApi.setDisabled(userId, disabled);
    users.value = users.value.map((u) => (u.id === userId ? { ...u, disabled: updated.disabled } : u));
  }

  return { users: readonly(users), loaded: readonly(loaded), load, setDisabled };
});
