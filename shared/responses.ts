/**
 * The API's answers, typed once for the server (which builds them) and the client (which reads
 * them). Dates are ISO 8601 strings, as they travel in JSON; `expiresOn` is a YYYY-MM-DD date.
 * `tests/unit/responses.test.ts` checks the server's services return exactly these shapes.
 */
import type { OptionDetail, ScenarioResultsSummary, MonteCarloResult } from './engine/index.js';
import type { Herd, Scenario } from './schema';
import type { FarmRole } from './schema/accounts';
import type { ReviewStatusValue } from './schema/lender';
import type { MilkRecordImport } from './schema/milk-records';
import type { FieldChange } from './scenario-diff';
import type { UnitSystem } from './units';

/** Every `error.code` the API answers with; the client words each one (src/api/messages.ts). */
export const errorCodes = [
  'invalid_input',
  'invalid_json',
  'bad_request',
  'payload_too_large',
  'unsupported_type',
  'unauthorized',
  'invalid_credentials',
  'invalid_token',
  'wrong_account',
  'sign_in_required',
  'rate_limited',
  'cross_site',
  'forbidden',
  'not_found',
  'file_missing',
  'conflict',
  'version_conflict',
  'email_taken',
  'already_member',
  'already_shared',
  'already_revoked',
  'last_owner',
  'quota_exceeded',
  'not_on_capital_line',
  'out_of_range',
  'baseline_missing',
  'database_unavailable',
  'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];

export const scenarioStatuses = ['draft', 'decided', 'archived'] as const;
export type ScenarioStatus = (typeof scenarioStatuses)[number];

/** Who saved what and when, beside a scenario. */
export interface ScenarioMeta {
  id: number;
  farmId: number;
  name: string;
  status: ScenarioStatus;
  version: number;
  createdAt: string;
  createdBy: string | null;
  updatedAt: string;
  updatedBy: string | null;
}

declare const jsonOf: unique symbol;
/**
 * The JSON text of a `T`, written by the server around results it keeps as text and sent as it
 * is. `key` names the content (the same key always comes with the same text), so the server can
 * remember the text's compressed forms without reading the text.
 */
export interface JsonText<T> {
  readonly text: string;
  readonly key: string;
  readonly [jsonOf]?: T;
}

/**
 * GET S, and every save: the document, its version and the summary of its results (no yearly
 * lines or loan payments: GET S/results/detail has those).
 */
export interface ScenarioView {
  id: number;
  scenario: Scenario;
  version: number;
  results: ScenarioResultsSummary;
  meta: ScenarioMeta;
}

/** GET S/results/detail: each option's yearly lines and loan payments at one version. */
export interface ResultsDetailView {
  version: number;
  options: OptionDetail[];
}

/** One row of GET F/scenarios. */
export interface ScenarioListItem {
  id: number;
  name: string;
  status: ScenarioStatus;
  version: number;
  optionCount: number;
  /** Best candidate by the NPV of its change against the current option at the last save (negative when none pays); null with no candidate. */
  best: { optionId: string; name: string; npv: number } | null;
  updatedAt: string;
  updatedBy: string | null;
}

/** The body of a 409 `version_conflict`: a newer version saved since ours was loaded. */
export interface VersionConflict {
  version: number;
  updatedBy: string | null;
  updatedAt: string;
}

export interface VersionListItem {
  version: number;
  note: string;
  author: string | null;
  createdAt: string;
}

/** GET S/versions/:version: a past version, read-only, with the summary of its results. */
export interface VersionView {
  version: number;
  scenario: Scenario;
  note: string;
  author: string | null;
  createdAt: string;
  results: ScenarioResultsSummary;
}

/** GET S/versions/compare. */
export interface VersionComparison {
  from: number;
  to: number;
  units: UnitSystem;
  changes: FieldChange[];
}

/** GET/PUT F/baseline: SI units; `herd` null until the baseline is first saved. */
export interface FarmBaseline {
  herd: Herd | null;
  currency: string;
  locale: string;
  units: UnitSystem;
}

/** GET /invitations/:token. */
export interface InvitationPreview {
  farmName: string;
  role: FarmRole;
  email: string;
  inviterName: string | null;
  expiresAt: string;
  /** True when the address already has an account (the invitee signs in instead of signing up). */
  accountExists: boolean;
}

export const shareStates = ['pending', 'live', 'revoked', 'expired'] as const;
export type ShareState = (typeof shareStates)[number];

/** A lender share as the API answers it (never the token or its hash). */
export interface ShareView {
  id: number;
  scenarioId: number;
  scenarioName: string;
  version: number;
  lenderEmail: string;
  lenderName: string | null;
  state: ShareState;
  /** YYYY-MM-DD: from this date (UTC) the share no longer opens. */
  expiresOn: string;
  acceptedAt: string | null;
  revokedAt: string | null;
  reviewStatus: ReviewStatusValue;
  reviewStatusAt: string | null;
  reviewStatusBy: string | null;
  sharedBy: string | null;
  createdAt: string;
}

export interface ReviewNote {
  id: number;
  author: string | null;
  authorRole: FarmRole;
  optionId: string | null;
  /** The option's name in the shared version, when the note is about one. */
  optionName: string | null;
  lineRef: string | null;
  body: string;
  createdAt: string;
}

export interface ReviewThread extends ReviewNote {
  replies: ReviewNote[];
}

export interface ShareReview {
  share: ShareView;
  notes: ReviewThread[];
}

export interface Preference {
  userId: number;
  name: string;
  /** The person's role on the farm; null if they have since left it. */
  role: FarmRole | null;
  optionId: string;
  reason: string;
  updatedAt: string;
}

export interface Decision {
  id: number;
  optionId: string;
  optionName: string;
  decidedBy: { id: number; name: string } | null;
  decidedAt: string;
  note: string;
  scenarioVersion: number;
}

export interface PreferencesView {
  preferences: Preference[];
  /** The decision in force (the latest), or null. */
  decision: Decision | null;
  /** Earlier decisions, newest first. */
  earlierDecisions: Decision[];
}

/** The Monte Carlo result kept with a scenario. */
export interface RiskResultView {
  result: MonteCarloResult;
  scenarioVersion: number;
  inputsHash: string;
  /** True when the saved scenario's inputs still hash to the result's hash. */
  fresh: boolean;
  savedBy: string | null;
  savedAt: string;
}

export interface AuditEntry {
  id: number;
  actor: string;
  action: string;
  /** The action in words, for the log screen. */
  description: string;
  subject: string;
  detail: Record<string, unknown>;
  createdAt: string;
}

export interface AuditPage {
  entries: AuditEntry[];
  nextBefore: number | null;
}

/** One of the caller's farms, as GET /farms lists it. */
export interface FarmSummary {
  id: number;
  name: string;
  location: string;
  role: FarmRole;
  currency: string;
  units: UnitSystem;
}

/** GET /farms/:farmId: the farm and the caller's role; `baseline` (the stored herd) is null for a lender. */
export interface FarmDetail extends FarmSummary {
  locale: string;
  baseline: unknown;
  createdAt: string;
}

/** The signed-in account, as GET /auth/me and every sign-in answer name it. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** GET /auth/me: the account and its farm memberships. */
export interface Session {
  user: SessionUser;
  memberships: { farmId: number; role: FarmRole }[];
}

/** An open invitation, as the owner's list shows it. */
export interface PendingInvitation {
  id: number;
  email: string;
  role: FarmRole;
  expiresAt: string;
  createdAt: string;
}

/** One row of GET F/members. */
export interface FarmMember {
  userId: number;
  name: string;
  email: string;
  role: FarmRole;
  since: string;
}

/** PATCH F/members/:userId. */
export interface MemberRoleChange {
  userId: number;
  role: FarmRole;
}

/** The answer of accepting an invitation: the session it signed in, and the farm joined. */
export interface AcceptedInvitation extends Session {
  farmId: number;
}

/** The answer of accepting a lender share: the session, and where the shared scenario is. */
export interface AcceptedShare extends Session {
  farmId: number;
  scenarioId: number;
  shareId: number;
}

/** One row of GET /admin/users. */
export interface AccountListing {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
  disabled: boolean;
  createdAt: string;
  farmCount: number;
}

/** PATCH /admin/users/:userId: the account as it is now. */
export type AccountUpdate = Omit<AccountListing, 'createdAt' | 'farmCount'>;

/** GET F/milk-records: the herd fields an import sets, as the baseline holds them now, and past imports. */
export interface MilkRecordHistory {
  baseline: { cows: number | null; yieldKgPerCowDay: number | null };
  imports: MilkRecordImport[];
}

/** One e-mail of GET /dev/outbox (captured instead of sent when no SMTP server is set). */
export interface CapturedMail {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  html?: string;
  sentAt: string;
  /** The http(s) links in the text, so the outbox screen can make them clickable. */
  links: string[];
  /** Size in bytes of the built message. */
  size: number;
}
