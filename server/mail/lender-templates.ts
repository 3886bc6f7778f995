/** The e-mails of lender shares and reviews, as plain text with a simple HTML twin (every value escaped). */
import type { MailMessage } from './mailer.js';
import { escapeHtml } from './templates.js';

function html(paragraphs: string[], link: { href: string; label: string }): string {
  const body = paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('');
  return `${body}<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`;
}

/** The lender's link to a shared scenario version; `link` carries the raw single-use token. */
export function lenderShareMail(input: {
  to: string;
  farmName: string;
  scenarioName: string;
  version: number;
  sharerName: string;
  expiresOn: string;
  message?: string;
  link: string;
}): MailMessage {
  const lines = [
    `${input.sharerName} has shared version ${input.version} of the scenario "${input.scenarioName}" of ${input.farmName} with you on Byrecast, read-only, for your review.`,
    ...(input.message ? [`Their message: ${input.message}`] : []),
    `The link works once: open it, then sign up or sign in with this address. The share ends on ${input.expiresOn} or when the farm withdraws it.`,
  ];
  return {
    to: input.to,
    subject: `${input.farmName} shared "${input.scenarioName}" with you on Byrecast`,
    text: `${lines.join('\n\n')}\n\nOpen the shared scenario: ${input.link}\n\nIf you did not expect this, ignore this e-mail.\n`,
    html: html([...lines, 'If you did not expect this, ignore this e-mail.'], { href: input.link, label: 'Open the shared scenario' }),
  };
}

/** Tells a farm member that the lender changed the review status of a shared version. */
export function reviewStatusMail(input: {
  to: string;
  farmName: string;
  scenarioName: string;
  version: number;
  lenderName: string;
  status: string;
  note?: string;
  link: string;
}): MailMessage {
  const lines = [
    `${input.lenderName} set the review of version ${input.version} of "${input.scenarioName}" (${input.farmName}) to: ${input.status}.`,
    ...(input.note ? [`Latest note: ${input.note}`] : []),
  ];
  return {
    to: input.to,
    subject: `Review status of "${input.scenarioName}": ${input.status}`,
    text: `${lines.join('\n\n')}\n\nRead the notes and answer them: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Read the notes and answer them' }),
  };
}

/** A new note from the lender, to each member: who wrote it, on what, the note itself and the way to answer. */
export function reviewNoteMail(input: {
  to: string;
  farmName: string;
  scenarioName: string;
  version: number;
  lenderName: string;
  about?: string;
  note: string;
  link: string;
}): MailMessage {
  const lines = [
    `${input.lenderName} wrote a note on version ${input.version} of "${input.scenarioName}" (${input.farmName})${input.about ? `, about ${input.about}` : ''}.`,
    `Note: ${input.note}`,
  ];
  return {
    to: input.to,
    subject: `New lender note on "${input.scenarioName}"`,
    text: `${lines.join('\n\n')}\n\nRead the note and answer it: ${input.link}\n`,
    html: html(lines, { href: input.link, label: 'Read the note and answer it' }),
  };
}
