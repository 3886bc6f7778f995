import type { CapturedMail } from '@shared/responses';
import { http } from './client';

export type { CapturedMail };

/** The dev outbox: e-mails captured instead of sent (only when no SMTP server is configured). */
export const outboxApi = {
  list: () => http.get<{ messages: CapturedMail[] }>('/dev/outbox'),
};
