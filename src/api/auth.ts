import type {
  ChangePasswordInput,
  PasswordResetInput,
  PasswordResetRequestInput,
  SignInInput,
  SignUpInput,
  UpdateProfileInput,
} from '@shared/schema/accounts';
import type { Session, SessionUser } from '@shared/responses';
import { http } from './client';

export type { Session, SessionUser };

export const authApi = {
  /** null when signed out. */
  me: () => http.get<Session | null>('/auth/me'),
  signIn: (input: SignInInput) => http.post<Session>('/auth/sign-in', input),
  signUp: (input: SignUpInput) => http.post<Session>('/auth/sign-up', input),
  signOut: () => http.post<void>('/auth/sign-out'),
  updateProfile: (input: UpdateProfileInput) => http.patch<Session>('/auth/me', input),
  changePassword: (input: ChangePasswordInput) => http.post<void>('/auth/me/password', input),
  requestPasswordReset: (input: PasswordResetRequestInput) => http.post<{ message: string }>('/auth/password-reset/request', input),
  completePasswordReset: (input: PasswordResetInput) => http.post<void>('/auth/password-reset/complete', input),
};
