/**
 * The one place the client words what went wrong: `messageFor(error)` turns an `ApiError` (by the
 * server's `error.code`, shared/responses.ts) or anything else thrown into a sentence for the
 * screen. Field paths never reach the user: "scenario.herd.cows: Herd size must be a whole
 * number" reads "Cows in the herd: must be a whole number", named as the forms name the field.
 */
import type { Scenario } from '@shared/schema';
import type { ErrorCode } from '@shared/responses';
import { ApiError } from './client';
import { fieldLabel } from './field-labels';

type Wording = string | ((error: ApiError) => string);

/** The server's own sentence, when it is written for people (no field path in front). */
const serverSentence = (fallback: string) => (error: ApiError) => plainSentence(error.message) ?? fallback;

const BY_CODE: Record<ErrorCode, Wording> = {
  invalid_input: serverSentence('Some figures are not right: check the fields marked in red.'),
  invalid_json: 'The request could not be read. Reload the page and try again.',
  bad_request: 'The request could not be read. Reload the page and try again.',
  payload_too_large: serverSentence('This is too large to send.'),
  unsupported_type: serverSentence('This kind of file cannot be uploaded.'),
  unauthorized: 'Your session has ended. Sign in again.',
  invalid_credentials: 'E-mail or password is not right.',
  invalid_token: serverSentence('This link is not valid any more. Ask for a new one.'),
  wrong_account: serverSentence('This link is for another account. Sign out and open it again.'),
  sign_in_required: serverSentence('An account for this address exists. Sign in, then open the link again.'),
  rate_limited: serverSentence('Too many attempts. Try again in a few minutes.'),
  cross_site: 'This request came from another site and was refused. Open Byrecast directly and try again.',
  forbidden: 'Your role on this farm does not allow this.',
  not_found: 'This is not here any more: it may have been deleted, or it is no longer shared with you.',
  file_missing: 'The stored file for this document is missing. Upload it again.',
  conflict: serverSentence('Someone changed this at the same time. Reload and try again.'),
  version_conflict: 'Someone saved a newer version while you were editing. Load theirs or keep yours as a copy.',
  email_taken: 'An account with this e-mail already exists. Sign in instead.',
  already_member: serverSentence('This person is already a member of the farm.'),
  already_shared: serverSentence('This version is already shared with this address.'),
  already_revoked: 'This share was already revoked.',
  last_owner: serverSentence('A farm needs at least one owner.'),
  quota_exceeded: serverSentence("The farm's documents are over their quota; delete old documents first."),
  not_on_capital_line: 'Only a document attached to a capital line can carry a quote amount.',
  out_of_range: serverSentence('Some figures are outside what Byrecast can use.'),
  baseline_missing: 'Set the farm baseline (herd and markets) before creating a scenario from it.',
  database_unavailable: 'Byrecast cannot reach its database just now. Try again in a moment.',
  internal: 'Something went wrong on our side. Please try again.',
};

const NETWORK = 'Cannot reach Byrecast. Check your connection and try again.';
const FALLBACK = 'Something went wrong. Please try again.';

/** A sentence that starts with a field path ("scenario.herd.cows: …") is for programs, not people. */
const PATH_PREFIX = /^([A-Za-z_][\w]*(?:\.[\w-]+)*):\s*/;

function plainSentence(message: string): string | null {
  if (!message) return null;
  const match = PATH_PREFIX.exec(message);
  if (!match) return message;
  const path = match[1] ?? '';
  return fieldSentence(path, message.slice(match[0].length));
}

/**
 * "Cows in the herd: must be a whole number": the form's label, then what is wrong. The schema
 * words its messages "<its own label> must …", so the part from "must" on is kept.
 */
export function fieldSentence(path: string, message: string, scenario?: Pick<Scenario, 'options'> | null): string {
  const must = /\bmust\b.*$/s.exec(message);
  const rest = must ? must[0] : message.charAt(0).toLowerCase() + message.slice(1);
  return `${fieldLabel(path, scenario)}: ${rest}`;
}

/** A message beside its field, named by the label the reader sees there: "Cows must be a whole number". */
export function inlineMessage(label: string, message: string | undefined): string | undefined {
  if (!message) return message;
  const must = /\bmust\b.*$/s.exec(message);
  return must ? `${label} ${must[0]}` : message;
}

/** Every field message of an error as sentences, first field first. */
export function fieldSentences(error: unknown, scenario?: Pick<Scenario, 'options'> | null): string[] {
  if (!(error instanceof ApiError)) return [];
  return Object.entries(error.fields).map(([path, message]) => fieldSentence(path, message, scenario));
}

/**
 * What to tell the user about `error`: the first bad field in the form's words, else the wording
 * for the server's code, else `fallback` (what the screen was trying to do).
 */
export function messageFor(error: unknown, fallback = FALLBACK, scenario?: Pick<Scenario, 'options'> | null): string {
  if (!(error instanceof ApiError)) return fallback;
  if (error.code === 'network' || error.status === 0) return NETWORK;
  const first = fieldSentences(error, scenario)[0];
  if (first) return first;
  const wording = BY_CODE[error.code as ErrorCode];
  if (wording) return typeof wording === 'string' ? wording : wording(error);
  return fallback;
}
