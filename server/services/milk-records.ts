/**
 * Milk-record import: the upload, parsed while it streamed in (server/http/milk-record-upload.ts),
 * is previewed, and on confirm the farm baseline takes the herd size and yield of the file's last
 * period; every confirmed import is kept.
 */
import { randomBytes } from 'node:crypto';
import { herdSchema } from '../../shared/schema/herd.js';
import type { MilkRecordImport, MilkRecordPreview, MilkRecordSummary } from '../../shared/schema/milk-records.js';
import type { Database } from '../db/client.js';
import {
  applyMilkImport,
  deleteExpiredMilkPreviews,
  findMilkImport,
  findMilkPreview,
  insertMilkPreview,
  listMilkImports,
  readHerdFields,
  type MilkImportRecord,
} from '../db/repositories/documents.js';
import { AppError, conflict, notFound } from '../errors.js';
import type { DocumentActor } from './documents.js';

/** Largest milk-record file (bytes): 200 000 rows with fat and protein take about 7 MB. */
export const MAX_MILK_RECORD_BYTES = 32 * 1024 * 1024;
/** How long a preview can be confirmed (ms). */
const PREVIEW_LIFETIME_MS = 60 * 60 * 1000;

/** What the upload engine leaves on req.file. */
export interface ParsedMilkUpload {
  fileName: string;
  summary: MilkRecordSummary;
}

/** Keeps the preview for an hour and returns it with the token that confirms it. */
export async function previewMilkRecords(db: Database, actor: DocumentActor, upload: ParsedMilkUpload, now = new Date()): Promise<MilkRecordPreview> {
  await deleteExpiredMilkPreviews(db, now);
  const token = randomBytes(16).toString('hex');
  const expiresAt = new Date(now.getTime() + PREVIEW_LIFETIME_MS);
  await insertMilkPreview(db, { farmId: actor.farmId, token, expiresAt, ...recordFields(actor, upload) });
  return { token, fileName: upload.fileName, expiresAt: expiresAt.toISOString(), summary: upload.summary };
}

function recordFields(actor: DocumentActor, { fileName, summary }: ParsedMilkUpload) {
  return {
    fileName,
    rowsRead: summary.rowsRead,
    rowsAccepted: summary.rowsAccepted,
    rowsRefused: summary.rowsRefused,
    firstDate: summary.firstDate,
    lastDate: summary.lastDate,
    herdSize: summary.herdSize,
    averageYieldKgPerCowDay: summary.averageYieldKgPerCowDay,
    summary,
    createdBy: actor.userId,
  };
}

/** The herd size and yield a summary gives, checked against the baseline's own limits (409 naming the field). */
function baselineValues(summary: MilkRecordSummary): { herdSize: number; yieldKgPerCowDay: number } {
  if (summary.herdSize < 1 || summary.averageYieldKgPerCowDay === null) {
    throw conflict('The file has no accepted rows, so there is no herd size or yield to set');
  }
  const checks = [
    ['herdSize', herdSchema.shape.cows.safeParse(summary.herdSize)],
    ['yieldKgPerCowDay', herdSchema.shape.yieldKgPerCowDay.safeParse(summary.averageYieldKgPerCowDay)],
  ] as const;
  for (const [field, check] of checks) {
    if (!check.success) {
      const message = check.error.issues[0]?.message ?? 'out of range';
      throw new AppError(409, 'out_of_range', `${field}: ${message}`, { [field]: message });
    }
  }
  return { herdSize: summary.herdSize, yieldKgPerCowDay: summary.averageYieldKgPerCowDay };
}

function toImportView(record: MilkImportRecord): MilkRecordImport {
  return {
    id: record.id,
    fileName: record.fileName,
    rowsRead: record.rowsRead,
    rowsAccepted: record.rowsAccepted,
    rowsRefused: record.rowsRefused,
    firstDate: record.firstDate,
    lastDate: record.lastDate,
    herdSize: record.herdSize,
    averageYieldKgPerCowDay: record.averageYieldKgPerCowDay ?? 0,
    previousHerdSize: record.previousHerdSize,
    previousYieldKgPerCowDay: record.previousYieldKgPerCowDay,
    importedBy: record.confirmedBy,
    confirmedAt: (record.confirmedAt ?? record.createdAt).toISOString(),
  };
}

/**
 * Applies a preview (by its token) or a freshly parsed file to the farm baseline and keeps the
 * import record. A token that is unknown, expired or already used is a 409.
 */
export async function confirmMilkRecords(
  db: Database,
  actor: DocumentActor,
  source: { token: string } | { upload: ParsedMilkUpload },
  now = new Date(),
): Promise<MilkRecordImport> {
  let importId: number | null;
  if ('token' in source) {
    const preview = await findMilkPreview(db, actor.farmId, source.token, now);
    if (!preview) throw conflict('This preview has expired or was already confirmed; upload the file again');
    const values = baselineValues(preview.summary as MilkRecordSummary);
    importId = await applyMilkImport(db, { farmId: actor.farmId, userId: actor.userId, now, ...values, importId: preview.id });
    if (importId === null) throw conflict('This preview was already confirmed');
  } else {
    const values = baselineValues(source.upload.summary);
    importId = await applyMilkImport(db, { farmId: actor.farmId, userId: actor.userId, now, ...values, fresh: { farmId: actor.farmId, ...recordFields(actor, source.upload) } });
  }
  const record = importId === null ? null : await findMilkImport(db, actor.farmId, importId);
  if (!record) throw notFound('Import not found');
  return toImportView(record);
}

/** The herd fields as the baseline holds them now, and the farm's confirmed imports, newest first. */
export async function milkRecordHistory(
  db: Database,
  farmId: number,
): Promise<{ baseline: { cows: number | null; yieldKgPerCowDay: number | null }; imports: MilkRecordImport[] }> {
  const baseline = await readHerdFields(db, farmId);
  if (!baseline) throw notFound('Farm not found');
  return { baseline, imports: (await listMilkImports(db, farmId)).map(toImportView) };
}
