/** Lender share and review note request bodies, shared by the client forms and the API. */
import { z } from 'zod';
import { emailSchema } from './accounts';

export const REVIEW_STATUSES = ['open', 'questions', 'supported', 'not-supported'] as const;
export type ReviewStatusValue = (typeof REVIEW_STATUSES)[number];

/** The words docs/product.md gives each review status. */
export const REVIEW_STATUS_LABELS: Record<ReviewStatusValue, string> = {
  open: 'Open',
  questions: 'Questions',
  supported: 'Supported',
  'not-supported': 'Not supported',
};

/** What the accept page shows for a share link (the API's answer, typed once for both sides). */
export interface SharePreview {
  farmName: string;
  scenarioName: string;
  version: number;
  email: string;
  sharedBy: string | null;
  expiresOn: string;
  /** True when the address has an account (the lender signs in instead of signing up). */
  accountExists: boolean;
}

/** Longest a share may run before it must be renewed (a lender's review rarely takes longer). */
export const MAX_SHARE_DAYS = 366;

/** Today's date in UTC as YYYY-MM-DD, the calendar shares expire by. */
export function utcDate(now: Date): string {
  return now.toISOString().slice(0, 10);
}

/** The UTC date `days` after `now`, as YYYY-MM-DD. */
export function utcDatePlusDays(now: Date, days: number): string {
  return utcDate(new Date(now.getTime() + days * 24 * 60 * 60 * 1000));
}

const isoDate = z
  .string({ error: 'Expiry date is required' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Expiry date must be a date such as 2027-03-31')
  .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), 'Expiry date is not a real date');

export const createShareSchema = z.object({
  email: emailSchema,
  /** The version to share; the latest when left out. */
  version: z.coerce.number({ error: 'Version must be a number' }).int('Version must be a whole number').min(1, 'Version must be at least 1').optional(),
  /** From this date (UTC) the share no longer opens. */
  expiresOn: isoDate,
  message: z.string().trim().max(1000, 'Message must be at most 1000 characters').optional(),
});

const noteBody = z.string({ error: 'Note is required' }).trim().min(1, 'Write the note first').max(4000, 'Note must be at most 4000 characters');

export const createNoteSchema = z.object({
  body: noteBody,
  optionId: z.string().trim().min(1).max(60, 'Option id must be at most 60 characters').optional(),
  lineRef: z.string().trim().min(1).max(120, 'Line must be at most 120 characters').optional(),
  /** The note this one answers (the lender answering a member's reply). */
  parentId: z.coerce.number({ error: 'Parent note must be a number' }).int().min(1).optional(),
});

export const replySchema = z.object({ body: noteBody });

export const reviewStatusSchema = z.object({
  status: z.enum(REVIEW_STATUSES, { error: 'Status must be open, questions, supported or not-supported' }),
});

export const auditQuerySchema = z.object({
  limit: z.coerce.number({ error: 'Limit must be a number' }).int().min(1, 'Limit must be at least 1').max(200, 'Limit must be at most 200').default(50),
  before: z.coerce.number({ error: 'Before must be a number' }).int().min(1).optional(),
});

export type CreateShareInput = z.input<typeof createShareSchema>;
export type CreateNoteInput = z.input<typeof createNoteSchema>;
