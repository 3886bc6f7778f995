/**
 * The farm's audit log: every lender share, review note and review status change (and lender
 * workbook download), who did it and when. Written by the services that do those things,
 * read by the owner.
 */
import type { AuditPage } from '../../shared/responses.js';
import type { Database } from '../db/client.js';
import type { Executor } from '../db/repositories/farms.js';
import { insertAudit, listAudit } from '../db/repositories/lender.js';

export const AUDIT_ACTIONS = {
  'share.created': 'Shared a scenario version with a lender',
  'share.accepted': 'Accepted a lender share',
  'share.revoked': 'Revoked a lender share',
  'note.added': 'Wrote a review note',
  'note.replied': 'Replied to a review note',
  'review.status': 'Set the review status',
  'workbook.downloaded': 'Downloaded the lender workbook',
} as const;

export type AuditAction = keyof typeof AUDIT_ACTIONS;

/** Who acted, on which farm. */
export interface AuditActor {
  farmId: number;
  userId: number;
  name: string;
}


/** Appends one entry; runs inside the caller's transaction when given one, so the change and its record land together. */
export async function recordAudit(db: Executor, actor: AuditActor, action: AuditAction, subject: string, detail: Record<string, unknown>): Promise<void> {
  await insertAudit(db, { farmId: actor.farmId, actorId: actor.userId, actorName: actor.name.slice(0, 120), action, subject: subject.slice(0, 240), detail });
}

/** A page of the log, newest first; `before` is the id of the last entry already shown. */
export async function readAuditLog(db: Database, farmId: number, limit: number, before?: number): Promise<AuditPage> {
  const rows = await listAudit(db, farmId, limit, before);
  const entries = rows.map((row) => {
    const action = row.action as AuditAction;
    return {
      id: row.id,
      actor: row.actorName,
      action,
      description: AUDIT_ACTIONS[action] ?? row.action,
      subject: row.subject,
      detail: row.detail,
      createdAt: row.createdAt.toISOString(),
    };
  });
  const last = entries.at(-1);
  return { entries, nextBefore: entries.length === limit && last ? last.id : null };
}
