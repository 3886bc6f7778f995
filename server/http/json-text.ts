/**
 * Sends JSON the services wrote as text (kept results) without parsing and re-serialising it.
 * The same text is asked for again and again (a scenario version read by many), so its gzip and
 * brotli forms and its ETag are made once and remembered by the text's key for the most recent
 * texts; the compression middleware leaves an answer that already has a Content-Encoding alone.
 */
import { createHash } from 'node:crypto';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import type { Request, Response } from 'express';
import type { JsonText } from '../../shared/responses.js';

interface Encoded {
  etag: string;
  gzip?: Buffer;
  br?: Buffer;
}

/** Texts remembered (most recently sent last): at ~100 KB of JSON a text, about 3 MB of encodings. */
const REMEMBERED = 128;
/** Below this an answer is sent as any other (the middleware compresses it if worth it). */
const REMEMBER_FROM_CHARS = 8 * 1024;
/** Per app, as keys name content within one database. */
let rememberedBy = new WeakMap<object, Map<string, Encoded>>();

/** Forgets every remembered encoding: for tests that change kept texts in the database behind the server's back. */
export function forgetEncodedTexts(): void {
  rememberedBy = new WeakMap();
}

function encodedOf(app: object, { key, text }: JsonText<unknown>): Encoded {
  let remembered = rememberedBy.get(app);
  if (!remembered) {
    remembered = new Map();
    rememberedBy.set(app, remembered);
  }
  let entry = remembered.get(key);
  if (entry) {
    remembered.delete(key);
  } else {
    entry = { etag: `"${createHash('sha1').update(text).digest('base64url')}"` };
    if (remembered.size >= REMEMBERED) remembered.delete(remembered.keys().next().value as string);
  }
  remembered.set(key, entry);
  return entry;
}

export function sendJsonText<T>(req: Request, res: Response, json: JsonText<T>, status = 200): void {
  res.status(status).type('application/json');
  if (status !== 200 || json.text.length < REMEMBER_FROM_CHARS) {
    res.send(json.text);
    return;
  }
  const entry = encodedOf(req.app, json);
  res.set('ETag', entry.etag);
  res.vary('Accept-Encoding');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  const encoding = req.acceptsEncodings('br', 'gzip', 'identity');
  if (encoding === 'br') {
    entry.br ??= brotliCompressSync(json.text, { params: { [constants.BROTLI_PARAM_QUALITY]: 5, [constants.BROTLI_PARAM_SIZE_HINT]: json.text.length } });
    res.set('Content-Encoding', 'br').send(entry.br);
  } else if (encoding === 'gzip') {
    entry.gzip ??= gzipSync(json.text, { level: 6 });
    res.set('Content-Encoding', 'gzip').send(entry.gzip);
  } else {
    res.send(json.text);
  }
}
