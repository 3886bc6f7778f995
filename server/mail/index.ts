import nodemailer from 'nodemailer';
import type { Logger } from 'pino';
import type { AppConfig } from '../config.js';
import { createMemoryMailer, type Mailer } from './mailer.js';

/** Real SMTP when SMTP_URL is set; otherwise an in-process outbox. */
export async function createMailer(config: AppConfig, logger: Logger): Promise<Mailer> {
  if (!config.smtpUrl) return createMemoryMailer(config.mailFrom);
  const transport = nodemailer.createTransport(config.smtpUrl);
  return {
    async send(message) {
      await transport.sendMail({ from: config.mailFrom, ...message });
      logger.info({ to: message.to, subject: message.subject }, 'mail sent');
    },
    async close() {
      transport.close();
    },
  };
}
