/** The e-mails Byrecast sends, as plain text with a simple HTML twin (every value escaped). */
import type { FarmRole } from '../db/schema/index.js';
import type { MailMessage } from './mailer.js';

const ROLE_WORDS: Record<FarmRole, string> = {
  owner: 'an owner',
  partner: 'a family partner',
  consultant: 'the consultant',
  lender: 'the loan officer (read-only)',
};

/** Escapes text for an HTML body. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function html(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  return `${body}<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`;
}

/** The invitation to join a farm; `link` carries the raw token. */
export function invitationMail(input: { to: string; farmName: string; inviterName: string; role: FarmRole; link: string; expiresDays: number }): MailMessage {
  const lines = [
    `${input.inviterName} has invited you to join ${input.farmName} on Byrecast as ${ROLE_WORDS[input.role]}.`,
    `The link works once and expires in ${input.expiresDays} days.`,
  ];
  return {
    to: input.to,
    subject: `Join ${input.farmName} on Byrecast`,
    text: `${lines.join('\n\n')}\n\nAccept the invitation: ${input.link}\n\nIf you did not expect this, ignore this e-mail.\n`,
    html: html([...lines, 'If you did not expect this, ignore this e-mail.'], { href: input.link, label: 'Accept the invitation' }),
  };
}

/** The password-reset link; `link` carries the raw token. */
export function passwordResetMail(input: { to: string; name: string; link: string }): MailMessage {
  const lines = [
    `Hello ${input.name},`,
    'Someone asked to reset the password of your Byrecast account. The link works once, for one hour. Setting a new password signs you out everywhere.',
  ];
  return {
    to: input.to,
    subject: 'Reset your Byrecast password',
    text: `${lines.join('\n\n')}\n\nSet a new password: ${input.link}\n\nIf it was not you, ignore this e-mail; your password stays as it is.\n`,
    html: html([...lines, 'If it was not you, ignore this e-mail; your password stays as it is.'], { href: input.link, label: 'Set a new password' }),
  };
}
