import type { AccountListing, AccountUpdate } from '@shared/responses';
import { http } from './client';

export type { AccountListing };

/** Account administration (administrators only). */
export const adminApi = {
  users: () => http.get<AccountListing[]>('/admin/users'),
  setDisabled: (userId: number, disabled: boolean) => http.patch<AccountUpdate>(`/admin/users/${userId}`, { disabled }),
};
