/**
 * Document uploads over HTTP: a multer storage engine that inspects each file while streaming it
 * into storage (type sniffed from the bytes, size and quota counted, name sanitised, sha-256),
 * and the stored upload it leaves on the request. The rules of what may be kept are here because
 * they run on the stream; what the farm does with a kept file is in services/documents.ts.
 */
import { createHash } from 'node:crypto';
import { Transform, type Readable, type TransformCallback } from 'node:stream';
import { fileTypeFromBuffer } from 'file-type';
import type { Request } from 'express';
import type multer from 'multer';
import { documentTypes, type DocumentMediaType } from '../../shared/schema/documents.js';
import { farmAccess } from '../auth/middleware.js';
import { AppError } from '../errors.js';
import type { FileStorage } from '../storage/index.js';
import { formatMegabytes, type StoredUpload } from '../services/documents.js';

/** Bytes read before deciding the type: enough for every signature file-type checks, zip-based XLSX included. */
const SNIFF_BYTES = 64 * 1024;
const MAX_NAME_LENGTH = 120;
const ALLOWED_LIST = Object.values(documentTypes)
  .map((t) => t.label)
  .join(', ');

/**
 * A file name safe to store, show and send back: the last path segment only (so
 * `../../etc/passwd` becomes `passwd`), no control or reserved characters, no leading dots,
 * at most 120 characters with the extension kept.
 */
export function sanitiseFileName(name: string): string {
  const lastSegment = name.split(/[/\\]/).pop() ?? '';
  const cleaned = lastSegment
    .normalize('NFC')
    // eslint-disable-next-line no-control-regex -- control characters are what is being removed
    .replace(/[\u0000-\u001f\u007f-\u009f]/g, '')
    .replace(/[^\p{L}\p{N} ._()+,-]/gu, '_')
    .replace(/\s+/g, ' ')
    .replace(/^[.\s]+/, '')
    .trim();
  if (cleaned === '') return 'document';
  if (cleaned.length <= MAX_NAME_LENGTH) return cleaned;
  const dot = cleaned.lastIndexOf('.');
  const extension = dot > 0 && cleaned.length - dot <= 10 ? cleaned.slice(dot) : '';
  return cleaned.slice(0, MAX_NAME_LENGTH - extension.length) + extension;
}

/** The name with an extension that matches the sniffed type (a PDF named `quote.png` becomes `quote.png.pdf`). */
export function nameForType(fileName: string, mediaType: DocumentMediaType): string {
  const extensions: readonly string[] = documentTypes[mediaType].extensions;
  const dot = fileName.lastIndexOf('.');
  const current = dot > 0 ? fileName.slice(dot + 1).toLowerCase() : '';
  return extensions.includes(current) ? fileName : sanitiseFileName(`${fileName}.${extensions[0] ?? 'bin'}`);
}

/** True when text looks like delimited rows: the first line and most others split on one of , ; or tab. */
export function looksDelimited(text: string, complete: boolean): boolean {
  const lines = text.split(/\r?\n/);
  if (!complete) lines.pop(); // the last line of a head may be cut short
  const rows = lines.filter((l) => l.trim() !== '').slice(0, 20);
  const first = rows[0];
  if (first === undefined) return false;
  const delimiter = [',', ';', '\t'].find((d) => first.includes(d));
  if (!delimiter) return false;
  return rows.filter((r) => r.includes(delimiter)).length >= Math.ceil(rows.length * 0.8);
}

const unsupported = (what: string) =>
  new AppError(415, 'unsupported_type', `This file is ${what}; upload a ${ALLOWED_LIST} file`, { file: `Only ${ALLOWED_LIST} files` });

/**
 * The document type of a file from its first bytes (and, for CSV, its name): PDF, PNG, JPEG,
 * WebP and XLSX by signature; CSV, which has none, only when the name ends .csv and the bytes
 * are text without NUL that looks like delimited rows. Throws a 415 AppError otherwise.
 */
export async function sniffDocumentType(head: Buffer, fileName: string, complete: boolean): Promise<DocumentMediaType> {
  const detected = await fileTypeFromBuffer(head);
  if (detected) {
    if (detected.mime in documentTypes && detected.mime !== 'text/csv') return detected.mime as DocumentMediaType;
    throw unsupported(`a ${detected.ext.toUpperCase()} file (${detected.mime})`);
  }
  if (!/\.csv$/i.test(fileName)) throw unsupported('not a type Byrecast keeps');
  if (head.includes(0)) throw unsupported('binary data named .csv');
  let text: string;
  try {
    // `stream: true` lets a multi-byte character cut at the end of the head pass.
    text = new TextDecoder('utf-8', { fatal: true }).decode(head, { stream: !complete });
  } catch {
    throw unsupported('not UTF-8 text, so not a CSV file Byrecast can read');
  }
  if (!looksDelimited(text.replace(/^\uFEFF/, ''), complete)) throw unsupported('text that does not look like comma- or semicolon-separated rows');
  return 'text/csv';
}

export class QuotaExceededError extends AppError {
  constructor(quotaBytes: number) {
    super(413, 'quota_exceeded', `This upload would take the farm past its document storage quota of ${formatMegabytes(quotaBytes)}; delete old documents first`, {
      file: 'The farm document quota is full',
    });
  }
}

/**
 * A pass-through that counts bytes against `limitBytes`, hashes them (sha-256), holds back the
 * first SNIFF_BYTES until the type is known, and for CSV checks the whole file is UTF-8 without
 * NUL. Any refusal errors the stream, so whatever is storing it discards what it has.
 */
class UploadInspector extends Transform {
  private readonly hash = createHash('sha256');
  private head: Buffer[] = [];
  private headLength = 0;
  private textDecoder: TextDecoder | null = null;
  size = 0;
  mediaType: DocumentMediaType | null = null;

  constructor(
    private readonly fileName: string,
    private readonly limitBytes: number,
    private readonly onLimit: () => Error,
  ) {
    super();
  }

  override _transform(chunk: Buffer, _encoding: BufferEncoding, callback: TransformCallback): void {
    this.size += chunk.length;
    if (this.size > this.limitBytes) return callback(this.onLimit());
    this.hash.update(chunk);
    if (this.mediaType) {
      try {
        this.checkText(chunk, false);
      } catch (error) {
        return callback(error as Error);
      }
      return callback(null, chunk);
    }
    this.head.push(chunk);
    this.headLength += chunk.length;
    if (this.headLength < SNIFF_BYTES) return callback();
    this.decide(false).then(() => callback(), callback);
  }

  override _flush(callback: TransformCallback): void {
    const finish = (): void => {
      this.checkText(Buffer.alloc(0), true);
      callback();
    };
    if (this.mediaType) {
      try {
        finish();
      } catch (error) {
        callback(error as Error);
      }
      return;
    }
    this.decide(true).then(finish, callback);
  }

  digest(): string {
    return this.hash.digest('hex');
  }

  private async decide(complete: boolean): Promise<void> {
    const head = Buffer.concat(this.head);
    this.head = [];
    this.mediaType = await sniffDocumentType(head, this.fileName, complete);
    if (this.mediaType === 'text/csv') {
      this.textDecoder = new TextDecoder('utf-8', { fatal: true });
      this.checkText(head, false);
    }
    this.push(head);
  }

  /** Throws for CSV bytes that are not UTF-8 or hold NUL anywhere in the file. */
  private checkText(chunk: Buffer, end: boolean): void {
    if (!this.textDecoder) return;
    if (chunk.includes(0)) throw unsupported('binary data named .csv');
    try {
      this.textDecoder.decode(chunk, { stream: !end });
    } catch {
      throw unsupported('not UTF-8 text, so not a CSV file Byrecast can read');
    }
  }
}

/**
 * A multer storage engine that inspects the upload while streaming it into `storage`: the
 * farm's remaining quota is looked up first and enforced byte by byte (413 as soon as it is
 * passed). multer's own fileSize limit ends the stream at 15 MB; the engine then discards the
 * part it stored. On any failure nothing is kept.
 */
export function documentStorageEngine(remainingQuota: (farmId: number) => Promise<number>, storage: FileStorage, quotaBytes: number): multer.StorageEngine {
  return {
    _handleFile(req: Request, file, callback) {
      const store = async (): Promise<StoredUpload> => {
        const remaining = await remainingQuota(farmAccess(req).farmId);
        const fileName = sanitiseFileName(file.originalname);
        const inspector = new UploadInspector(fileName, remaining, () => new QuotaExceededError(quotaBytes));
        // busboy ends a stream cut at the size limit normally; turn that into a failure so the partial file goes.
        file.stream.once('limit', () => inspector.destroy(new AppError(413, 'payload_too_large', 'The file is larger than 15 MB')));
        // Not pipeline(): a refused file must not tear down the request stream, or multer would
        // answer before the partial file is gone. The rest of the body is drained instead.
        file.stream.once('error', (error) => inspector.destroy(error));
        inspector.once('error', () => {
          file.stream.unpipe(inspector);
          file.stream.resume();
        });
        file.stream.pipe(inspector);
        const storageKey = await storage.put(inspector as unknown as Readable);
        if (!inspector.mediaType) throw new Error('upload stored without a sniffed type');
        return { storageKey, fileName: nameForType(fileName, inspector.mediaType), mediaType: inspector.mediaType, sizeBytes: inspector.size, sha256: inspector.digest() };
      };
      store().then(
        (stored) => callback(null, { ...stored, size: stored.sizeBytes } as Partial<Express.Multer.File>),
        (error: unknown) => {
          file.stream.resume();
          callback(error);
        },
      );
    },
    _removeFile(_req, file, callback) {
      const { storageKey } = file as unknown as Partial<StoredUpload>;
      if (!storageKey) return callback(null);
      storage.delete(storageKey).then(() => callback(null), callback);
    },
  };
}

/** The stored upload multer left on the request, or a 400 naming the `file` field. */
export function uploadedFile(req: Request): StoredUpload {
  const file = req.file as unknown as StoredUpload | undefined;
  if (!file?.storageKey) throw new AppError(400, 'invalid_input', 'file: choose a file to upload', { file: 'Choose a file to upload' });
  return file;
}
