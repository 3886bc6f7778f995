/** Outgoing e-mail. Real SMTP only when SMTP_URL is set; otherwise messages land in an outbox. */
export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface SentMail extends MailMessage {
  id: number;
  from: string;
  sentAt: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  /** Captured messages, newest first; present only when no real SMTP server is configured. */
  outbox?: { list(): SentMail[]; clear(): void };
  close(): Promise<void>;
}

/** Keeps messages in memory; the dev outbox page and the tests read them. */
export function createMemoryMailer(from: string): Mailer {
  const messages: SentMail[] = [];
  let nextId = 1;
  return {
    async send(message) {
      messages.unshift({ ...message, id: nextId++, from, sentAt: new Date().toISOString() });
      if (messages.length > 500) messages.pop();
    },
    outbox: { list: () => [...messages], clear: () => void messages.splice(0) },
    async close() {},
  };
}
