/** /api/farms/:farmId/documents… and the quotes of a scenario's capital lines: parse → service → respond. */
import { pipeline } from 'node:stream/promises';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import { documentListQuerySchema, documentPatchSchema, documentTargetSchema, MAX_DOCUMENT_BYTES } from '../../shared/schema/documents.js';
import type { AppDeps } from '../app.js';
import { type FarmRoute } from '../auth/middleware.js';
import { AppError, parseOrThrow } from '../errors.js';
import { documentStorageEngine, uploadedFile } from '../http/document-upload.js';
import { actorOf, idParam } from '../http/params.js';
import {
  listVisibleDocuments,
  openDocument,
  recordUpload,
  removeDocument,
  scenarioQuotes,
  remainingQuotaBytes,
  setQuoteAmount,
  
} from '../services/documents.js';
import { createFileStorage } from '../storage/index.js';

/**
 * Runs a multer middleware and turns its errors into AppErrors: too large → 413, wrong parts
 * → 400 naming the `file` field. Errors the storage engine raised (type, quota) pass as they are.
 */
export function runUpload(upload: RequestHandler, maxBytes: number): RequestHandler {
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (error?: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          const mb = Math.round(maxBytes / (1024 * 1024));
          return next(new AppError(413, 'payload_too_large', `The file is larger than ${mb} MB`, { file: `At most ${mb} MB` }));
        }
        return next(new AppError(400, 'invalid_input', `file: send one file in the multipart field "file" (${error.message})`, { file: 'Send one file' }));
      }
      next(error);
    });
  };
}

export function documentRoutes({ db, config }: AppDeps, route: FarmRoute): void {
  const storage = createFileStorage(config);
  const upload = multer({
    storage: documentStorageEngine((farmId) => remainingQuotaBytes(db, farmId, config.documentQuotaBytes), storage, config.documentQuotaBytes),
    limits: { fileSize: MAX_DOCUMENT_BYTES, files: 1, fields: 5, fieldSize: 200, parts: 6 },
  }).single('file');

  route('post', '/documents', 'document:write', runUpload(upload, MAX_DOCUMENT_BYTES), async (req, res) => {
    const stored = uploadedFile(req);
    let target;
    try {
      target = parseOrThrow(documentTargetSchema, { ...req.body });
    } catch (error) {
      await storage.delete(stored.storageKey);
      throw error;
    }
    const document = await recordUpload(db, storage, actorOf(req), stored, target, config.documentQuotaBytes);
    res.status(201).json(document);
  });

  route('get', '/documents', 'document:read', async (req, res) => {
    const filter = parseOrThrow(documentListQuerySchema, { ...req.query });
    res.json(await listVisibleDocuments(db, actorOf(req), filter));
  });

  route('get', '/documents/:documentId/download', 'document:read', async (req, res) => {
    const { document, stream } = await openDocument(db, storage, actorOf(req), idParam(req, 'documentId', 'Document id'));
    res.status(200);
    res.attachment(document.fileName);
    res.set({
      'Content-Type': document.mediaType,
      'Content-Length': String(document.sizeBytes),
      'X-Content-Type-Options': 'nosniff',
      'Cache-Control': 'private, no-store',
    });
    await pipeline(stream, res);
  });

  route('patch', '/documents/:documentId', 'document:write', async (req, res) => {
    const documentId = idParam(req, 'documentId', 'Document id');
    const { quoteAmount } = parseOrThrow(documentPatchSchema, req.body);
    res.json(await setQuoteAmount(db, actorOf(req), documentId, quoteAmount));
  });

  route('delete', '/documents/:documentId', 'document:write', async (req, res) => {
    await removeDocument(db, storage, actorOf(req), idParam(req, 'documentId', 'Document id'));
    res.status(204).end();
  });

  route('get', '/scenarios/:scenarioId/quotes', 'document:read', async (req, res) => {
    res.json({ lines: await scenarioQuotes(db, actorOf(req), idParam(req, 'scenarioId', 'Scenario id')) });
  });
}
