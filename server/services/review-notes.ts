/**
 * Review notes and the review status of a lender share. The lender writes notes on the version
 * shared with them (optionally about one option or one line) and sets the status; the farm's
 * members read them, answer in a thread and get an e-mail when the status changes. Every note,
 * reply and status change goes into the audit log in the same transaction.
 */
import type { ReviewNote, ReviewThread, ShareReview } from '../../shared/responses.js';
import { REVIEW_STATUS_LABELS, type ReviewStatusValue } from '../../shared/schema/lender.js';
import type { z } from 'zod';
import type { createNoteSchema } from '../../shared/schema/lender.js';
import type { Database } from '../db/client.js';
import { findFarm, listMembers } from '../db/repositories/farms.js';
import { findNote, findShare, insertNote, listNotes, listShares, setReviewStatus, type NoteRecord, type ShareRecord } from '../db/repositories/lender.js';
import { findVersion } from '../db/repositories/scenarios.js';
import { AppError, notFound } from '../errors.js';
import { reviewNoteMail, reviewStatusMail } from '../mail/lender-templates.js';
import { recordAudit } from './audit.js';
import { liveSharesOf, shareState } from './lender-access.js';
import { shareSubject, toShareView, type LenderContext, type ShareView } from './lender-shares.js';
import { accessToScenario, type Actor } from './access.js';

/** Arranges notes (oldest first) into threads: top-level notes, each with its replies in order. */
export function threadNotes(notes: readonly NoteRecord[], optionNames: ReadonlyMap<string, string>): ReviewThread[] {
  const flat = (n: NoteRecord): ReviewNote => ({
    id: n.id,
    author: n.authorName,
    authorRole: n.authorRole,
    optionId: n.optionId,
    optionName: n.optionId ? (optionNames.get(n.optionId) ?? null) : null,
    lineRef: n.lineRef,
    body: n.body,
    createdAt: n.createdAt.toISOString(),
  });
  const roots = new Map<number, ReviewThread>();
  for (const note of notes) if (note.parentId === null) roots.set(note.id, { ...flat(note), replies: [] });
  for (const note of notes) if (note.parentId !== null) roots.get(note.parentId)?.replies.push(flat(note));
  return [...roots.values()];
}

async function optionNamesOf(db: Database, share: Pick<ShareRecord, 'scenarioId' | 'version'>): Promise<Map<string, string>> {
  const version = await findVersion(db, share.scenarioId, share.version);
  const document = version?.document;
  return new Map((document?.options ?? []).map((o) => [o.id, o.name]));
}

/**
 * The reviews of one scenario the caller may read: for members every share of it, for a lender
 * only their own live shares (a scenario without one is "not found", as everywhere else).
 */
export async function scenarioReviews(db: Database, actor: Actor, scenarioId: number, now = new Date()): Promise<ShareReview[]> {
  let shares: ShareRecord[];
  await accessToScenario(db, actor, scenarioId, now);
  if (actor.role === 'lender') {
    shares = (await liveSharesOf(db, actor.farmId, actor.userId, now)).filter((s) => s.scenarioId === scenarioId);
  } else {
    shares = await listShares(db, actor.farmId, scenarioId);
  }
  const notes = await listNotes(db, shares.map((s) => s.id));
  return Promise.all(
    shares.map(async (share) => ({
      share: toShareView(share, now),
      notes: threadNotes(
        notes.filter((n) => n.shareId === share.id),
        await optionNamesOf(db, share),
      ),
    })),
  );
}

/** The share a lender acts on: theirs and live, or 404 (a revoked or expired share ends writing too). */
async function lendersLiveShare(db: Database, actor: Actor, shareId: number, now: Date): Promise<ShareRecord> {
  const share = await findShare(db, actor.farmId, shareId);
  if (!share || share.lenderUserId !== actor.userId || shareState(share, now) !== 'live') throw notFound('Share not found');
  return share;
}

const auditActor = (actor: Actor) => ({ farmId: actor.farmId, userId: actor.userId, name: actor.name });

async function noteView(db: Database, actor: Actor, share: ShareRecord, noteId: number): Promise<ReviewNote> {
  const note = await findNote(db, actor.farmId, noteId);
  if (!note) throw new Error('note vanished after insert');
  const [view] = threadNotes([{ ...note, parentId: null }], await optionNamesOf(db, share));
  if (!view) throw new Error('note vanished after insert');
  const { replies: _replies, ...rest } = view;
  return rest;
}

/** The thread a new note joins: the root of `parentId`, which must be a note of the same share. */
async function threadRoot(db: Database, farmId: number, shareId: number, parentId: number): Promise<number> {
  const parent = await findNote(db, farmId, parentId);
  if (!parent || parent.shareId !== shareId) throw new AppError(400, 'invalid_input', 'parentId: no such note on this share', { parentId: 'No such note on this share' });
  return parent.parentId ?? parent.id;
}

/** The farm's members a lender's action is e-mailed to (everyone but lenders) and the link to the scenario's Lender tab. */
async function farmRecipients(db: Database, actor: Actor, share: ShareRecord, appOrigin: string) {
  const [farm, members] = await Promise.all([findFarm(db, actor.farmId), listMembers(db, actor.farmId)]);
  return {
    farmName: farm?.name ?? 'your farm',
    members: members.filter((m) => m.role !== 'lender'),
    link: `${appOrigin}/farms/${actor.farmId}/scenarios/${share.scenarioId}/lender`,
  };
}

/**
 * The lender's note on their live share. `optionId`, when given, must be an option of the shared
 * version; `lineRef` names a line (and needs an option); `parentId` answers a note in a thread.
 * Like a status change, the note is e-mailed to the farm's members so a question does not wait unread.
 */
export async function addLenderNote(ctx: LenderContext, actor: Actor, shareId: number, input: z.output<typeof createNoteSchema>, now = new Date()): Promise<ReviewNote> {
  const { db } = ctx;
  const share = await lendersLiveShare(db, actor, shareId, now);
  const options = await optionNamesOf(db, share);
  if (input.optionId !== undefined && !options.has(input.optionId)) {
    throw new AppError(400, 'invalid_input', 'optionId: no such option in the shared version', { optionId: 'No such option in the shared version' });
  }
  if (input.lineRef !== undefined && input.optionId === undefined) {
    throw new AppError(400, 'invalid_input', 'optionId: choose the option the line belongs to', { optionId: 'Choose the option the line belongs to' });
  }
  const parentId = input.parentId === undefined ? null : await threadRoot(db, actor.farmId, shareId, input.parentId);
  const id = await db.transaction(async (tx) => {
    const noteId = await insertNote(tx, {
      farmId: actor.farmId,
      scenarioId: share.scenarioId,
      shareId,
      authorId: actor.userId,
      authorRole: actor.role,
      optionId: input.optionId ?? null,
      lineRef: input.lineRef ?? null,
      parentId,
      body: input.body,
    });
    await recordAudit(tx, auditActor(actor), parentId === null ? 'note.added' : 'note.replied', shareSubject(share), {
      shareId,
      noteId,
      scenarioId: share.scenarioId,
      version: share.version,
      ...(input.optionId ? { optionId: input.optionId } : {}),
      ...(input.lineRef ? { lineRef: input.lineRef } : {}),
    });
    return noteId;
  });
  const view = await noteView(db, actor, share, id);
  const { farmName, members, link } = await farmRecipients(db, actor, share, ctx.appOrigin);
  const about = [view.optionName, view.lineRef].filter((part): part is string => Boolean(part)).join(' › ');
  for (const member of members) {
    await ctx.mailer.send(
      reviewNoteMail({
        to: member.email,
        farmName,
        scenarioName: share.scenarioName,
        version: share.version,
        lenderName: actor.name,
        ...(about ? { about } : {}),
        note: view.body.slice(0, 500),
        link,
      }),
    );
  }
  return view;
}

/** A member's answer in the thread of a note on one of the farm's shares (any state: answering a closed review is still a record). */
export async function replyToNote(db: Database, actor: Actor, shareId: number, noteId: number, body: string): Promise<ReviewNote> {
  const share = await findShare(db, actor.farmId, shareId);
  if (!share) throw notFound('Share not found');
  const note = await findNote(db, actor.farmId, noteId);
  if (!note || note.shareId !== shareId) throw notFound('Note not found');
  const rootId = note.parentId ?? note.id;
  const id = await db.transaction(async (tx) => {
    const replyId = await insertNote(tx, { farmId: actor.farmId, scenarioId: share.scenarioId, shareId, authorId: actor.userId, authorRole: actor.role, optionId: null, lineRef: null, parentId: rootId, body });
    await recordAudit(tx, auditActor(actor), 'note.replied', shareSubject(share), { shareId, noteId: replyId, inReplyTo: rootId, scenarioId: share.scenarioId, version: share.version });
    return replyId;
  });
  return noteView(db, actor, share, id);
}

/**
 * Sets the review status of the lender's live share. A change is audited and e-mailed to the
 * farm's members (owner, partners, consultant); setting the status it already has changes nothing.
 */
export async function setShareStatus(ctx: LenderContext, actor: Actor, shareId: number, status: ReviewStatusValue, now = new Date()): Promise<ShareView> {
  const share = await lendersLiveShare(ctx.db, actor, shareId, now);
  if (share.reviewStatus === status) return toShareView(share, now);
  await ctx.db.transaction(async (tx) => {
    await setReviewStatus(tx, shareId, status, actor.userId, now);
    await recordAudit(tx, auditActor(actor), 'review.status', shareSubject(share), { shareId, scenarioId: share.scenarioId, version: share.version, from: share.reviewStatus, to: status });
  });
  const [{ farmName, members, link }, notes] = await Promise.all([farmRecipients(ctx.db, actor, share, ctx.appOrigin), listNotes(ctx.db, [shareId])]);
  const latestNote = notes.filter((n) => n.authorRole === 'lender').at(-1);
  for (const member of members) {
    await ctx.mailer.send(
      reviewStatusMail({
        to: member.email,
        farmName,
        scenarioName: share.scenarioName,
        version: share.version,
        lenderName: actor.name,
        status: REVIEW_STATUS_LABELS[status],
        ...(latestNote ? { note: latestNote.body.slice(0, 500) } : {}),
        link,
      }),
    );
  }
  const updated = await findShare(ctx.db, actor.farmId, shareId);
  if (!updated) throw notFound('Share not found');
  return toShareView(updated, now);
}
