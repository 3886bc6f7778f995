import { http } from './client';

export interface CapturedMail {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  sentAt: string;
  links: string[];
}

/** The dev outbox: e-mails captured instead of sent (only when no SMTP server is configured). */
export const outboxApi = {
  list: () => http.get<{ messages: CapturedMail[] }>('/dev/outbox'),
};
