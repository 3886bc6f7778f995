/**
 * Milk-record import: what a preview reports, what confirm takes, and the kept record of an
 * import. The CSV reader (shared/milk-records/parse.ts) produces `MilkRecordSummary`.
 */
import { z } from 'zod';

/** Why a row of a milk-record file was not used. */
export const refusalReasons = [
  'bad_date',
  'negative_milk',
  'bad_milk',
  'unknown_unit',
  'duplicate_row',
  'missing_cow',
  'bad_fat',
  'bad_protein',
] as const;
export type RefusalReason = (typeof refusalReasons)[number];

/** Plain words for each reason, for the wizard and for error messages. */
export const refusalReasonLabels: Readonly<Record<RefusalReason, string>> = {
  bad_date: 'bad date',
  negative_milk: 'negative milk',
  bad_milk: 'milk is not a number',
  unknown_unit: 'unknown unit',
  duplicate_row: 'duplicate row',
  missing_cow: 'no cow id',
  bad_fat: 'fat % not a number from 0 to 100',
  bad_protein: 'protein % not a number from 0 to 100',
};

/** Days counted back from the file's last date (inclusive) for herd size and yield. */
export const MILK_RECORD_PERIOD_DAYS = 30;

export const milkRecordRowSchema = z.object({
  /** Line in the file, the header being line 1. */
  line: z.number().int(),
  cowId: z.string(),
  /** ISO date YYYY-MM-DD. */
  date: z.string(),
  milkKg: z.number(),
  fatPct: z.number().nullable(),
  proteinPct: z.number().nullable(),
});
export type MilkRecordRow = z.infer<typeof milkRecordRowSchema>;

export const refusedRowSchema = z.object({
  line: z.number().int(),
  reason: z.enum(refusalReasons),
  /** What was found, e.g. `date "31.02.2026"`. */
  detail: z.string(),
});
export type RefusedRow = z.infer<typeof refusedRowSchema>;

export const milkRecordSummarySchema = z.object({
  delimiter: z.enum([',', ';']),
  /** The unit the milk column was read in: from the header, or per row from a unit column. */
  unit: z.enum(['kg', 'lb', 'per row']),
  rowsRead: z.number().int(),
  rowsAccepted: z.number().int(),
  rowsRefused: z.number().int(),
  refusedByReason: z.partialRecord(z.enum(refusalReasons), z.number().int()),
  /** The first refused rows (at most MAX_REFUSED_LISTED); `refusedTruncated` says whether more exist. */
  refused: z.array(refusedRowSchema),
  refusedTruncated: z.boolean(),
  cowsInFile: z.number().int(),
  firstDate: z.string().nullable(),
  lastDate: z.string().nullable(),
  /** The last period of the file: MILK_RECORD_PERIOD_DAYS days ending on its last date. */
  period: z.object({ from: z.string(), to: z.string(), days: z.number().int() }).nullable(),
  /** Distinct cows with at least one accepted record in the period (head). */
  herdSize: z.number().int(),
  /** Accepted records in the period (cow-days). */
  recordsInPeriod: z.number().int(),
  /** Mean milk of the period's records, kg per cow per day, to 2 decimals; null when none. */
  averageYieldKgPerCowDay: z.number().nullable(),
  /** The first accepted rows, so the user sees what was read. */
  sample: z.array(milkRecordRowSchema),
});
export type MilkRecordSummary = z.infer<typeof milkRecordSummarySchema>;

/** Body of POST …/milk-records/confirm when confirming a preview (the file may be sent instead). */
export const milkRecordConfirmSchema = z.object({
  token: z
    .string({ error: 'Preview token must be text' })
    .regex(/^[0-9a-f]{32}$/, 'Preview token is not one this server gave out'),
});

/** A preview: what was read, and the token that confirms it. */
export interface MilkRecordPreview {
  token: string;
  fileName: string;
  expiresAt: string;
  summary: MilkRecordSummary;
}

/** The kept record of a confirmed import. */
export interface MilkRecordImport {
  id: number;
  fileName: string;
  rowsRead: number;
  rowsAccepted: number;
  rowsRefused: number;
  firstDate: string | null;
  lastDate: string | null;
  herdSize: number;
  averageYieldKgPerCowDay: number;
  /** The baseline before this import, null where it had no value. */
  previousHerdSize: number | null;
  previousYieldKgPerCowDay: number | null;
  importedBy: { id: number; name: string } | null;
  confirmedAt: string;
}
