/**
 * Documents on a farm, a scenario or a capital line: recording a stored upload within the quota,
 * who may see what, download, delete, and the quote amounts the capital table reads. The upload
 * stream itself (type sniffing, size, hashing) is inspected in server/http/document-upload.ts.
 */
import type { Readable } from 'node:stream';
import Decimal from 'decimal.js';
import {
  type CapitalLineQuotes,
  type DocumentMediaType,
  type DocumentTarget,
  type DocumentView,
} from '../../shared/schema/documents.js';
import type { Database } from '../db/client.js';
import {
  deleteDocument,
  farmDocumentBytes,
  findDocument,
  insertDocumentWithinQuota,
  listCapitalLineDocuments,
  listDocuments,
  updateQuoteAmount,
  type DocumentRecord,
} from '../db/repositories/documents.js';
import { findScenario } from '../db/repositories/scenarios.js';
import { AppError, notFound } from '../errors.js';
import { StoredFileMissingError, type FileStorage } from '../storage/index.js';
import { accessOf, accessToScenario, canSeeDocument, type Actor } from './access.js';

/** Who is asking, on which farm. */
export type DocumentActor = Actor;

/** What an inspected, stored upload is. */
export interface StoredUpload {
  storageKey: string;
  fileName: string;
  mediaType: DocumentMediaType;
  sizeBytes: number;
  sha256: string;
}

/** A size for messages, in MB with one decimal. */
export function formatMegabytes(bytes: number): string {
  return `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;
}

/** Bytes the farm may still store under its quota. */
export async function remainingQuotaBytes(db: Database, farmId: number, quotaBytes: number): Promise<number> {
  return Math.max(0, quotaBytes - (await farmDocumentBytes(db, farmId)));
}

/** Checks that the scenario is this farm's and, when given, that one of its options has the capital line. */
async function checkTarget(db: Database, farmId: number, target: DocumentTarget): Promise<void> {
  if (target.scenarioId === undefined) return;
  const scenario = await findScenario(db, farmId, target.scenarioId);
  if (!scenario) throw new AppError(400, 'invalid_input', 'scenarioId: no such scenario on this farm', { scenarioId: 'No such scenario on this farm' });
  if (target.capitalLineId === undefined) return;
  const document = scenario.document;
  const found = document.options.some((o) => o.capitalLines.some((l) => l.id === target.capitalLineId));
  if (!found) {
    throw new AppError(400, 'invalid_input', 'capitalLineId: no such capital line in this scenario', { capitalLineId: 'No such capital line in this scenario' });
  }
}

export function toDocumentView(d: DocumentRecord): DocumentView {
  return {
    id: d.id,
    fileName: d.fileName,
    mediaType: d.mediaType,
    sizeBytes: d.sizeBytes,
    sha256: d.sha256,
    scenarioId: d.scenarioId,
    capitalLineId: d.capitalLineId,
    quoteAmount: d.quoteAmount,
    uploadedBy: d.uploadedBy,
    createdAt: d.createdAt.toISOString(),
  };
}

/**
 * Records a stored upload against the farm (and scenario / capital line). The file is already
 * in storage; if the target is wrong or the quota filled up meanwhile, the file is deleted and
 * nothing is recorded.
 */
export async function recordUpload(
  db: Database,
  storage: FileStorage,
  actor: DocumentActor,
  stored: StoredUpload,
  target: DocumentTarget,
  quotaBytes: number,
): Promise<DocumentView> {
  try {
    await checkTarget(db, actor.farmId, target);
    const result = await insertDocumentWithinQuota(
      db,
      {
        farmId: actor.farmId,
        scenarioId: target.scenarioId ?? null,
        capitalLineId: target.capitalLineId ?? null,
        fileName: stored.fileName,
        mediaType: stored.mediaType,
        sizeBytes: stored.sizeBytes,
        sha256: stored.sha256,
        storageKey: stored.storageKey,
        uploadedBy: actor.userId,
      },
      quotaBytes,
    );
    if ('overQuota' in result) {
      throw new AppError(409, 'quota_exceeded', `The farm's documents would pass its quota of ${formatMegabytes(quotaBytes)}; delete old documents first`, {
        file: 'The farm document quota is full',
      });
    }
    const document = await findDocument(db, actor.farmId, result.id);
    if (!document) throw new Error('document vanished right after insert');
    return toDocumentView(document);
  } catch (error) {
    await storage.delete(stored.storageKey);
    throw error;
  }
}

/** The documents this caller may see, optionally of one scenario or capital line. */
export async function listVisibleDocuments(db: Database, actor: DocumentActor, filter: DocumentTarget): Promise<DocumentView[]> {
  const documents = await listDocuments(db, actor.farmId, filter);
  const access = await accessOf(db, actor);
  return documents.filter((d) => canSeeDocument(access, d)).map(toDocumentView);
}

async function visibleDocument(db: Database, actor: DocumentActor, documentId: number): Promise<DocumentRecord> {
  const document = await findDocument(db, actor.farmId, documentId);
  // A document the caller may not see is "not found", like a farm they are not on.
  if (!document || !canSeeDocument(await accessOf(db, actor), document)) throw notFound('Document not found');
  return document;
}

/** The document's metadata and a stream of its bytes; 404 when it is gone or not visible. */
export async function openDocument(
  db: Database,
  storage: FileStorage,
  actor: DocumentActor,
  documentId: number,
): Promise<{ document: DocumentView; stream: Readable }> {
  const document = await visibleDocument(db, actor, documentId);
  try {
    return { document: toDocumentView(document), stream: await storage.get(document.storageKey) };
  } catch (error) {
    if (error instanceof StoredFileMissingError) throw new AppError(404, 'file_missing', 'The stored file for this document is missing');
    throw error;
  }
}

/** Deletes the row and its file together (the row stays if the file cannot be removed). */
export async function removeDocument(db: Database, storage: FileStorage, actor: DocumentActor, documentId: number): Promise<void> {
  const removed = await deleteDocument(db, actor.farmId, documentId, (key) => storage.delete(key));
  if (!removed) throw notFound('Document not found');
}

/** Sets the quote amount (farm currency, rounded half-up to cents) on a document attached to a capital line. */
export async function setQuoteAmount(db: Database, actor: DocumentActor, documentId: number, amount: number | null): Promise<DocumentView> {
  const document = await visibleDocument(db, actor, documentId);
  if (document.capitalLineId === null) {
    throw new AppError(409, 'not_on_capital_line', 'quoteAmount: only a document attached to a capital line can carry a quote amount', {
      quoteAmount: 'Attach the document to a capital line first',
    });
  }
  const cents = amount === null ? null : new Decimal(amount).toDecimalPlaces(2, Decimal.ROUND_HALF_UP).toFixed(2);
  await updateQuoteAmount(db, actor.farmId, documentId, cents);
  return toDocumentView(await visibleDocument(db, actor, documentId));
}

/**
 * Per capital line of the scenario that has documents: its documents and the sum of the quote
 * amounts entered. Lines missing from the answer have no document (they are estimates).
 */
export async function scenarioQuotes(db: Database, actor: DocumentActor, scenarioId: number): Promise<CapitalLineQuotes[]> {
  const access = await accessToScenario(db, actor, scenarioId);
  const documents = (await listCapitalLineDocuments(db, actor.farmId, scenarioId)).filter((d) => canSeeDocument(access, d));
  const byLine = new Map<string, DocumentRecord[]>();
  for (const d of documents) {
    const line = d.capitalLineId ?? '';
    byLine.set(line, [...(byLine.get(line) ?? []), d]);
  }
  return [...byLine].map(([capitalLineId, docs]) => {
    const amounts = docs.map((d) => d.quoteAmount).filter((a): a is number => a !== null);
    return {
      capitalLineId,
      quoted: amounts.length > 0,
      quoteTotal: amounts.length > 0 ? amounts.reduce((sum, a) => sum.plus(a), new Decimal(0)).toNumber() : null,
      documents: docs.map((d) => ({ id: d.id, fileName: d.fileName, quoteAmount: d.quoteAmount })),
    };
  });
}
