/**
 * Document rows and milk-record imports as plain objects. Decimal columns come back from
 * MariaDB as strings and JSON columns as text: both are converted here, once.
 */
import { and, desc, eq, isNotNull, sql, type SQL } from 'drizzle-orm';
import type { MySqlColumn } from 'drizzle-orm/mysql-core';
import type { Database } from '../client.js';
import { documentsTable, farmsTable, milkRecordImportsTable, usersTable } from '../schema/index.js';

/** A transaction or the database: repository functions run in either. */
type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

export interface DocumentRecord {
  id: number;
  farmId: number;
  scenarioId: number | null;
  capitalLineId: string | null;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  storageKey: string;
  /** Farm currency; null when no amount was entered. */
  quoteAmount: number | null;
  uploadedBy: { id: number; name: string } | null;
  createdAt: Date;
}

export type NewDocument = Omit<DocumentRecord, 'id' | 'quoteAmount' | 'uploadedBy' | 'createdAt'> & { uploadedBy: number };

const decimalOrNull = (value: string | null): number | null => (value === null ? null : Number(value));

/** The user a row points at, with their name; null when the column is empty or the user is gone. */
const userOrNull = (id: number | null, name: string | null): { id: number; name: string } | null => (id !== null && name !== null ? { id, name } : null);

/** Rows of `table` with the name of the user in `userColumn` (null when none), for the mappers below. */
function selectWithUserName<T extends typeof documentsTable | typeof milkRecordImportsTable>(db: Executor, table: T, userColumn: MySqlColumn) {
  return db.select({ row: table, userName: usersTable.name }).from(table).leftJoin(usersTable, eq(usersTable.id, userColumn));
}

const selectDocuments = (db: Executor) => selectWithUserName(db, documentsTable, documentsTable.uploadedBy);

type DocumentSelectRow = Awaited<ReturnType<ReturnType<typeof selectDocuments>['execute']>>[number];

function toDocument({ row, userName }: DocumentSelectRow): DocumentRecord {
  return {
    id: row.id,
    farmId: row.farmId,
    scenarioId: row.scenarioId,
    capitalLineId: row.capitalLineId,
    fileName: row.fileName,
    mediaType: row.mediaType,
    sizeBytes: row.sizeBytes,
    sha256: row.sha256,
    storageKey: row.storageKey,
    quoteAmount: decimalOrNull(row.quoteAmount),
    uploadedBy: userOrNull(row.uploadedBy, userName),
    createdAt: row.createdAt,
  };
}

/** Bytes of all documents the farm keeps. */
export async function farmDocumentBytes(db: Executor, farmId: number): Promise<number> {
  const [row] = await db
    .select({ total: sql<string | null>`SUM(${documentsTable.sizeBytes})` })
    .from(documentsTable)
    .where(eq(documentsTable.farmId, farmId));
  return Number(row?.total ?? 0);
}

/**
 * Inserts the row unless the farm's documents would then pass `quotaBytes`; the farm row is
 * locked so two uploads cannot both squeeze into the last of the quota.
 */
export async function insertDocumentWithinQuota(
  db: Database,
  document: NewDocument,
  quotaBytes: number,
): Promise<{ id: number } | { overQuota: true; usedBytes: number }> {
  return db.transaction(async (tx) => {
    await tx.select({ id: farmsTable.id }).from(farmsTable).where(eq(farmsTable.id, document.farmId)).for('update');
    const usedBytes = await farmDocumentBytes(tx, document.farmId);
    if (usedBytes + document.sizeBytes > quotaBytes) return { overQuota: true as const, usedBytes };
    const [result] = await tx.insert(documentsTable).values(document);
    return { id: result.insertId };
  });
}

/** The farm's documents, newest first; narrowed to a scenario and a capital line when given. */
export async function listDocuments(
  db: Executor,
  farmId: number,
  filter: { scenarioId?: number; capitalLineId?: string } = {},
): Promise<DocumentRecord[]> {
  const conditions: SQL[] = [eq(documentsTable.farmId, farmId)];
  if (filter.scenarioId !== undefined) conditions.push(eq(documentsTable.scenarioId, filter.scenarioId));
  if (filter.capitalLineId !== undefined) conditions.push(eq(documentsTable.capitalLineId, filter.capitalLineId));
  const rows = await selectDocuments(db)
    .where(and(...conditions))
    .orderBy(desc(documentsTable.createdAt), desc(documentsTable.id));
  return rows.map(toDocument);
}

/** Documents of a scenario that sit on a capital line (the candidates for quotes). */
export async function listCapitalLineDocuments(db: Executor, farmId: number, scenarioId: number): Promise<DocumentRecord[]> {
  const rows = await selectDocuments(db)
    .where(and(eq(documentsTable.farmId, farmId), eq(documentsTable.scenarioId, scenarioId), isNotNull(documentsTable.capitalLineId)))
    .orderBy(documentsTable.capitalLineId, documentsTable.id);
  return rows.map(toDocument);
}

/** One document of this farm; null for an id of another farm. */
export async function findDocument(db: Executor, farmId: number, documentId: number): Promise<DocumentRecord | null> {
  const [row] = await selectDocuments(db).where(and(eq(documentsTable.farmId, farmId), eq(documentsTable.id, documentId)));
  return row ? toDocument(row) : null;
}

/**
 * Deletes the row and, inside the same transaction, calls `removeFile`: if removing the file
 * fails the row stays, so a listed document always has its file. Returns false when no such row.
 */
export async function deleteDocument(
  db: Database,
  farmId: number,
  documentId: number,
  removeFile: (storageKey: string) => Promise<void>,
): Promise<boolean> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select({ storageKey: documentsTable.storageKey })
      .from(documentsTable)
      .where(and(eq(documentsTable.farmId, farmId), eq(documentsTable.id, documentId)))
      .for('update');
    if (!row) return false;
    await tx.delete(documentsTable).where(eq(documentsTable.id, documentId));
    await removeFile(row.storageKey);
    return true;
  });
}

/** Sets or clears the quote amount (a decimal string with 2 places, or null). */
export async function updateQuoteAmount(db: Executor, farmId: number, documentId: number, amount: string | null): Promise<void> {
  await db
    .update(documentsTable)
    .set({ quoteAmount: amount })
    .where(and(eq(documentsTable.farmId, farmId), eq(documentsTable.id, documentId)));
}

// --- milk-record imports -------------------------------------------------------------------

export interface NewMilkPreview {
  farmId: number;
  token: string;
  fileName: string;
  rowsRead: number;
  rowsAccepted: number;
  rowsRefused: number;
  firstDate: string | null;
  lastDate: string | null;
  herdSize: number;
  averageYieldKgPerCowDay: number | null;
  summary: unknown;
  createdBy: number;
  expiresAt: Date;
}

export interface MilkImportRecord {
  id: number;
  farmId: number;
  status: 'preview' | 'confirmed';
  fileName: string;
  rowsRead: number;
  rowsAccepted: number;
  rowsRefused: number;
  firstDate: string | null;
  lastDate: string | null;
  herdSize: number;
  averageYieldKgPerCowDay: number | null;
  summary: unknown;
  previousHerdSize: number | null;
  previousYieldKgPerCowDay: number | null;
  confirmedBy: { id: number; name: string } | null;
  confirmedAt: Date | null;
  expiresAt: Date | null;
  createdAt: Date;
}

const yieldText = (value: number | null): string | null => (value === null ? null : value.toFixed(2));

const selectImports = (db: Executor) => selectWithUserName(db, milkRecordImportsTable, milkRecordImportsTable.confirmedBy);

type ImportSelectRow = Awaited<ReturnType<ReturnType<typeof selectImports>['execute']>>[number];

function toImport({ row, userName }: ImportSelectRow): MilkImportRecord {
  return {
    id: row.id,
    farmId: row.farmId,
    status: row.status,
    fileName: row.fileName,
    rowsRead: row.rowsRead,
    rowsAccepted: row.rowsAccepted,
    rowsRefused: row.rowsRefused,
    firstDate: row.firstDate,
    lastDate: row.lastDate,
    herdSize: row.herdSize,
    averageYieldKgPerCowDay: decimalOrNull(row.averageYieldKgPerCowDay),
    summary: typeof row.summary === 'string' ? JSON.parse(row.summary) : row.summary,
    previousHerdSize: row.previousHerdSize,
    previousYieldKgPerCowDay: decimalOrNull(row.previousYieldKgPerCowDay),
    confirmedBy: userOrNull(row.confirmedBy, userName),
    confirmedAt: row.confirmedAt,
    expiresAt: row.expiresAt,
    createdAt: row.createdAt,
  };
}

/** Keeps a preview so confirm can apply it by token; returns its id. */
export async function insertMilkPreview(db: Executor, preview: NewMilkPreview): Promise<number> {
  const [result] = await db.insert(milkRecordImportsTable).values({
    ...preview,
    status: 'preview',
    averageYieldKgPerCowDay: yieldText(preview.averageYieldKgPerCowDay),
  });
  return result.insertId;
}

/** The unconfirmed, unexpired preview of this farm with this token, or null. */
export async function findMilkPreview(db: Executor, farmId: number, token: string, now: Date): Promise<MilkImportRecord | null> {
  const [row] = await selectImports(db).where(
    and(
      eq(milkRecordImportsTable.farmId, farmId),
      eq(milkRecordImportsTable.token, token),
      eq(milkRecordImportsTable.status, 'preview'),
      sql`${milkRecordImportsTable.expiresAt} > ${now}`,
    ),
  );
  return row ? toImport(row) : null;
}

/** Confirmed imports of the farm, newest first. */
export async function listMilkImports(db: Executor, farmId: number): Promise<MilkImportRecord[]> {
  const rows = await selectImports(db)
    .where(and(eq(milkRecordImportsTable.farmId, farmId), eq(milkRecordImportsTable.status, 'confirmed')))
    .orderBy(desc(milkRecordImportsTable.confirmedAt), desc(milkRecordImportsTable.id));
  return rows.map(toImport);
}

/** One import of this farm, or null. */
export async function findMilkImport(db: Executor, farmId: number, importId: number): Promise<MilkImportRecord | null> {
  const [row] = await selectImports(db).where(and(eq(milkRecordImportsTable.farmId, farmId), eq(milkRecordImportsTable.id, importId)));
  return row ? toImport(row) : null;
}

function parseBaseline(value: unknown): Record<string, unknown> | null {
  const parsed: unknown = typeof value === 'string' ? JSON.parse(value) : value;
  return parsed !== null && typeof parsed === 'object' && !Array.isArray(parsed) ? (parsed as Record<string, unknown>) : null;
}

const numberOrNull = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);

/** The two herd fields a milk-record import sets, as farms.baseline holds them now (null when unset). */
export async function readHerdFields(db: Executor, farmId: number): Promise<{ cows: number | null; yieldKgPerCowDay: number | null } | null> {
  const [row] = await db.select({ baseline: farmsTable.baseline }).from(farmsTable).where(eq(farmsTable.id, farmId));
  if (!row) return null;
  const baseline = parseBaseline(row.baseline);
  return { cows: numberOrNull(baseline?.cows), yieldKgPerCowDay: numberOrNull(baseline?.yieldKgPerCowDay) };
}

/**
 * In one transaction: merges `cows` and `yieldKgPerCowDay` into farms.baseline (every other
 * field kept; a farm without a baseline gets one with just these two), and marks the import
 * confirmed with the values it replaced. `importId` is a preview to confirm; without it a
 * confirmed record is inserted from `fresh`. Returns the import's id, or null when the preview
 * was already confirmed.
 */
export async function applyMilkImport(
  db: Database,
  input: {
    farmId: number;
    userId: number;
    herdSize: number;
    yieldKgPerCowDay: number;
    now: Date;
  } & ({ importId: number } | { fresh: Omit<NewMilkPreview, 'token' | 'expiresAt'> }),
): Promise<number | null> {
  return db.transaction(async (tx) => {
    if ('importId' in input) {
      const [pending] = await tx
        .select({ status: milkRecordImportsTable.status })
        .from(milkRecordImportsTable)
        .where(eq(milkRecordImportsTable.id, input.importId))
        .for('update');
      // A second confirm of the same preview (double click, two tabs) must not apply it twice.
      if (pending?.status !== 'preview') return null;
    }
    const [farm] = await tx.select({ baseline: farmsTable.baseline }).from(farmsTable).where(eq(farmsTable.id, input.farmId)).for('update');
    if (!farm) throw new Error(`farm ${input.farmId} vanished during a milk-record import`);
    const before = parseBaseline(farm.baseline) ?? {};
    await tx
      .update(farmsTable)
      .set({ baseline: { ...before, cows: input.herdSize, yieldKgPerCowDay: input.yieldKgPerCowDay } })
      .where(eq(farmsTable.id, input.farmId));
    const confirmed = {
      status: 'confirmed' as const,
      token: null,
      previousHerdSize: numberOrNull(before.cows),
      previousYieldKgPerCowDay: yieldText(numberOrNull(before.yieldKgPerCowDay)),
      confirmedBy: input.userId,
      confirmedAt: input.now,
      expiresAt: null,
    };
    if ('importId' in input) {
      await tx.update(milkRecordImportsTable).set(confirmed).where(eq(milkRecordImportsTable.id, input.importId));
      return input.importId;
    }
    const [result] = await tx.insert(milkRecordImportsTable).values({
      ...input.fresh,
      ...confirmed,
      averageYieldKgPerCowDay: yieldText(input.fresh.averageYieldKgPerCowDay),
    });
    return result.insertId;
  });
}

/** Removes previews whose time ran out (they hold a summary nobody will confirm). */
export async function deleteExpiredMilkPreviews(db: Executor, now: Date): Promise<void> {
  await db
    .delete(milkRecordImportsTable)
    .where(and(eq(milkRecordImportsTable.status, 'preview'), sql`${milkRecordImportsTable.expiresAt} <= ${now}`));
}

