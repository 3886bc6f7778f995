/**
 * Outgoing e-mail. Real SMTP only when SMTP_URL is set; otherwise every message is still built by
 * nodemailer (headers, encoding, MIME parts) but kept in an in-process outbox instead of sent.
 */
import nodemailer from 'nodemailer';

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
  /** The http(s) links in the text body, so the dev outbox can make them clickable. */
  links: string[];
  /** Size in bytes of the message nodemailer built (RFC 5322 source). */
  size: number;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
  /** Captured messages, newest first; present only when no real SMTP server is configured. */
  outbox?: { list(): SentMail[]; clear(): void };
  close(): Promise<void>;
}

const OUTBOX_LIMIT = 500;

/** The http(s) URLs in a text, in order, without trailing punctuation. */
export function linksIn(text: string): string[] {
  return [...text.matchAll(/https?:\/\/[^\s<>"']+/g)].map((m) => m[0].replace(/[.,;:!?)]+$/, ''));
}

/** Keeps messages in memory; the dev outbox page and the tests read them. */
export function createMemoryMailer(from: string): Mailer {
  // streamTransport builds the complete message without any network, so what the outbox shows
  // is what an SMTP server would have received.
  const transport = nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' });
  const messages: SentMail[] = [];
  let nextId = 1;
  return {
    async send(message) {
      const info = await transport.sendMail({ from, ...message });
      const raw = info.message as Buffer;
      messages.unshift({ ...message, id: nextId++, from, sentAt: new Date().toISOString(), links: linksIn(message.text), size: raw.length });
      if (messages.length > OUTBOX_LIMIT) messages.pop();
    },
    outbox: { list: () => [...messages], clear: () => void messages.splice(0) },
    async close() {
      transport.close();
    },
  };
}
