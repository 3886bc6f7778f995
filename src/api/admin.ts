import { http } from './client';

export interface AccountListing {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
  disabled: boolean;
  createdAt: string;
  farmCount: number;
}

/** Account administration (administrators only). */
export const adminApi = {
  users: () => http.get<AccountListing[]>('/admin/users'),
  setDisabled: (userId: number, disabled: boolean) => http.patch<AccountListing>(`/admin/users/${userId}`, { disabled }),
};
