/** Lender shares, review notes and the audit log as plain objects; JSON columns parsed here. */
import { and, desc, eq, inArray, isNull, lt } from 'drizzle-orm';
import { alias } from 'drizzle-orm/mysql-core';
import {
  auditLogTable,
  farmsTable,
  lenderSharesTable,
  reviewNotesTable,
  scenariosTable,
  usersTable,
  type FarmRole,
  type ReviewStatus,
} from '../schema/index.js';
import type { Executor } from './farms.js';

export interface ShareRecord {
  id: number;
  farmId: number;
  scenarioId: number;
  scenarioName: string;
  version: number;
  lenderEmail: string;
  lenderUserId: number | null;
  lenderName: string | null;
  tokenUsedAt: Date | null;
  /** YYYY-MM-DD; the first day (UTC) on which the share no longer opens. */
  expiresOn: string;
  revokedAt: Date | null;
  reviewStatus: ReviewStatus;
  reviewStatusAt: Date | null;
  reviewStatusByName: string | null;
  createdBy: number | null;
  createdByName: string | null;
  createdAt: Date;
}

const lender = alias(usersTable, 'lender');
const creator = alias(usersTable, 'share_creator');
const statusSetter = alias(usersTable, 'status_setter');

function selectShares(db: Executor) {
  return db
    .select({
      id: lenderSharesTable.id,
      farmId: lenderSharesTable.farmId,
      scenarioId: lenderSharesTable.scenarioId,
      scenarioName: scenariosTable.name,
      version: lenderSharesTable.version,
      lenderEmail: lenderSharesTable.lenderEmail,
      lenderUserId: lenderSharesTable.lenderUserId,
      lenderName: lender.name,
      tokenUsedAt: lenderSharesTable.tokenUsedAt,
      expiresOn: lenderSharesTable.expiresOn,
      revokedAt: lenderSharesTable.revokedAt,
      reviewStatus: lenderSharesTable.reviewStatus,
      reviewStatusAt: lenderSharesTable.reviewStatusAt,
      reviewStatusByName: statusSetter.name,
      createdBy: lenderSharesTable.createdBy,
      createdByName: creator.name,
      createdAt: lenderSharesTable.createdAt,
    })
    .from(lenderSharesTable)
    .innerJoin(scenariosTable, eq(scenariosTable.id, lenderSharesTable.scenarioId))
    .leftJoin(lender, eq(lender.id, lenderSharesTable.lenderUserId))
    .leftJoin(creator, eq(creator.id, lenderSharesTable.createdBy))
    .leftJoin(statusSetter, eq(statusSetter.id, lenderSharesTable.reviewStatusBy));
}

export async function insertShare(
  db: Executor,
  share: { farmId: number; scenarioId: number; version: number; lenderEmail: string; tokenHash: string; expiresOn: string; createdBy: number; lenderUserId?: number; tokenUsedAt?: Date },
): Promise<number> {
  const [result] = await db.insert(lenderSharesTable).values(share);
  return result.insertId;
}

/** Shares of a farm, optionally of one scenario, newest first. */
export async function listShares(db: Executor, farmId: number, scenarioId?: number): Promise<ShareRecord[]> {
  const where = scenarioId === undefined ? eq(lenderSharesTable.farmId, farmId) : and(eq(lenderSharesTable.farmId, farmId), eq(lenderSharesTable.scenarioId, scenarioId));
  return selectShares(db).where(where).orderBy(desc(lenderSharesTable.createdAt), desc(lenderSharesTable.id));
}

/** Every share accepted by this account on this farm, whatever its state (the service decides which are live). */
export async function listSharesOfLender(db: Executor, farmId: number, userId: number): Promise<ShareRecord[]> {
  return selectShares(db)
    .where(and(eq(lenderSharesTable.farmId, farmId), eq(lenderSharesTable.lenderUserId, userId)))
    .orderBy(desc(lenderSharesTable.createdAt), desc(lenderSharesTable.id));
}

export async function findShare(db: Executor, farmId: number, shareId: number): Promise<ShareRecord | null> {
  const [row] = await selectShares(db).where(and(eq(lenderSharesTable.farmId, farmId), eq(lenderSharesTable.id, shareId)));
  return row ?? null;
}

/** The share a link's token hash belongs to, with the farm's name for the accept page. */
export async function findShareByTokenHash(db: Executor, tokenHash: string): Promise<(ShareRecord & { farmName: string }) | null> {
  const [row] = await db
    .select({ id: lenderSharesTable.id, farmId: lenderSharesTable.farmId, farmName: farmsTable.name })
    .from(lenderSharesTable)
    .innerJoin(farmsTable, eq(farmsTable.id, lenderSharesTable.farmId))
    .where(eq(lenderSharesTable.tokenHash, tokenHash));
  if (!row) return null;
  const share = await findShare(db, row.farmId, row.id);
  return share ? { ...share, farmName: row.farmName } : null;
}

/** Open (unused, unrevoked) shares of one scenario version to one address: a second share of it is refused. */
export async function findOpenShareTo(db: Executor, farmId: number, scenarioId: number, version: number, email: string): Promise<ShareRecord[]> {
  return selectShares(db).where(
    and(
      eq(lenderSharesTable.farmId, farmId),
      eq(lenderSharesTable.scenarioId, scenarioId),
      eq(lenderSharesTable.version, version),
      eq(lenderSharesTable.lenderEmail, email),
      isNull(lenderSharesTable.revokedAt),
    ),
  );
}

/** Uses the link: true only for the one caller that wins a race, and only while unrevoked. */
export async function claimShareToken(db: Executor, shareId: number, userId: number, now: Date): Promise<boolean> {
  const [result] = await db
    .update(lenderSharesTable)
    .set({ tokenUsedAt: now, lenderUserId: userId })
    .where(and(eq(lenderSharesTable.id, shareId), isNull(lenderSharesTable.tokenUsedAt), isNull(lenderSharesTable.revokedAt)));
  return result.affectedRows === 1;
}

export async function revokeShare(db: Executor, shareId: number, now: Date): Promise<boolean> {
  const [result] = await db
    .update(lenderSharesTable)
    .set({ revokedAt: now })
    .where(and(eq(lenderSharesTable.id, shareId), isNull(lenderSharesTable.revokedAt)));
  return result.affectedRows === 1;
}

export async function setReviewStatus(db: Executor, shareId: number, status: ReviewStatus, userId: number, now: Date): Promise<void> {
  await db
    .update(lenderSharesTable)
    .set({ reviewStatus: status, reviewStatusAt: now, reviewStatusBy: userId })
    .where(eq(lenderSharesTable.id, shareId));
}

export interface NoteRecord {
  id: number;
  shareId: number;
  scenarioId: number;
  authorId: number | null;
  authorName: string | null;
  authorRole: FarmRole;
  optionId: string | null;
  lineRef: string | null;
  parentId: number | null;
  body: string;
  createdAt: Date;
}

const noteColumns = {
  id: reviewNotesTable.id,
  shareId: reviewNotesTable.shareId,
  scenarioId: reviewNotesTable.scenarioId,
  authorId: reviewNotesTable.authorId,
  authorName: usersTable.name,
  authorRole: reviewNotesTable.authorRole,
  optionId: reviewNotesTable.optionId,
  lineRef: reviewNotesTable.lineRef,
  parentId: reviewNotesTable.parentId,
  body: reviewNotesTable.body,
  createdAt: reviewNotesTable.createdAt,
};

export async function insertNote(
  db: Executor,
  note: { farmId: number; scenarioId: number; shareId: number; authorId: number; authorRole: FarmRole; optionId: string | null; lineRef: string | null; parentId: number | null; body: string },
): Promise<number> {
  const [result] = await db.insert(reviewNotesTable).values(note);
  return result.insertId;
}

export async function findNote(db: Executor, farmId: number, noteId: number): Promise<NoteRecord | null> {
  const [row] = await db
    .select(noteColumns)
    .from(reviewNotesTable)
    .leftJoin(usersTable, eq(usersTable.id, reviewNotesTable.authorId))
    .where(and(eq(reviewNotesTable.farmId, farmId), eq(reviewNotesTable.id, noteId)));
  return row ?? null;
}

/** Notes of these shares, oldest first (threads read top to bottom). */
export async function listNotes(db: Executor, shareIds: readonly number[]): Promise<NoteRecord[]> {
  if (shareIds.length === 0) return [];
  return db
    .select(noteColumns)
    .from(reviewNotesTable)
    .leftJoin(usersTable, eq(usersTable.id, reviewNotesTable.authorId))
    .where(inArray(reviewNotesTable.shareId, [...shareIds]))
    .orderBy(reviewNotesTable.createdAt, reviewNotesTable.id);
}

export interface AuditRecord {
  id: number;
  actorId: number | null;
  actorName: string;
  action: string;
  subject: string;
  detail: Record<string, unknown>;
  createdAt: Date;
}

export async function insertAudit(
  db: Executor,
  entry: { farmId: number; actorId: number; actorName: string; action: string; subject: string; detail: Record<string, unknown> },
): Promise<void> {
  await db.insert(auditLogTable).values(entry);
}

/** A page of the farm's audit log, newest first; `beforeId` continues after the last row seen. */
export async function listAudit(db: Executor, farmId: number, limit: number, beforeId?: number): Promise<AuditRecord[]> {
  const where = beforeId === undefined ? eq(auditLogTable.farmId, farmId) : and(eq(auditLogTable.farmId, farmId), lt(auditLogTable.id, beforeId));
  const rows = await db
    .select({
      id: auditLogTable.id,
      actorId: auditLogTable.actorId,
      actorName: auditLogTable.actorName,
      action: auditLogTable.action,
      subject: auditLogTable.subject,
      detail: auditLogTable.detail,
      createdAt: auditLogTable.createdAt,
    })
    .from(auditLogTable)
    .where(where)
    .orderBy(desc(auditLogTable.id))
    .limit(limit);
  return rows.map((r) => ({ ...r, detail: (typeof r.detail === 'string' ? JSON.parse(r.detail) : r.detail) as Record<string, unknown> }));
}
