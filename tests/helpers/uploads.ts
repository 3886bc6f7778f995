/**
 * Helpers for upload tests: file bodies with real signatures, a multipart body written by hand
 * (so a test can send part of it and stop), the session cookie for raw HTTP, and polling.
 */
import { createHash } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import request from 'supertest';
import { expect } from 'vitest';

/** A tiny PDF: the %PDF- signature is what identifies the format (ISO 32000-1, 7.5.2 "File header"). */
export function pdfBytes(size = 2048): Buffer {
  const head = Buffer.from('%PDF-1.4\n%\xe2\xe3\xcf\xd3\n1 0 obj << /Type /Catalog >> endobj\n', 'latin1');
  const body = Buffer.alloc(Math.max(0, size - head.length - 6), 0x20);
  return Buffer.concat([head, body, Buffer.from('%%EOF\n')]);
}

/** PNG signature and an IHDR chunk (PNG specification, 5.2 "PNG signature"). */
export function pngBytes(): Buffer {
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    Buffer.from([0, 0, 0, 13]),
    Buffer.from('IHDR'),
    Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde]),
    Buffer.alloc(64),
  ]);
}

/** A Windows executable's start: "MZ" (the DOS header magic of the PE format). */
export function exeBytes(): Buffer {
  return Buffer.concat([Buffer.from('MZ\x90\x00\x03\x00\x00\x00\x04\x00\x00\x00\xff\xff\x00\x00', 'latin1'), Buffer.alloc(512)]);
}

export const sha256 = (bytes: Buffer): string => createHash('sha256').update(bytes).digest('hex');

/** The session cookie of a demo user, for raw HTTP requests. */
export async function sessionCookie(app: Express, email: string, password = 'byrecast-demo'): Promise<string> {
  const res = await request(app).post('/api/auth/sign-in').send({ email, password });
  expect(res.status).toBe(200);
  const cookies = res.headers['set-cookie'] as unknown as string[] | undefined;
  return (cookies ?? []).map((c) => c.split(';')[0]).join('; ');
}

export interface RawUpload {
  /** Sends the next bytes of the file part; resolves once the socket took them. */
  write(bytes: Buffer): Promise<void>;
  /** Ends the file part and the body; resolves with the status and parsed JSON answer. */
  finish(): Promise<{ status: number; body: unknown }>;
  /** Drops the connection mid-body, as a closed laptop or a lost network does. */
  abort(): void;
}

/** Starts a multipart upload of one file to `path` on a listening server, to be fed piece by piece. */
export function startRawUpload(server: http.Server, path: string, cookie: string, fileName: string): RawUpload {
  const boundary = '----byrecast-test-boundary';
  const { port } = server.address() as AddressInfo;
  const req = http.request({
    host: '127.0.0.1',
    port,
    path,
    method: 'POST',
    headers: { cookie, 'content-type': `multipart/form-data; boundary=${boundary}`, 'transfer-encoding': 'chunked' },
  });
  const response = new Promise<{ status: number; body: unknown }>((resolve, reject) => {
    req.on('response', (res) => {
      let text = '';
      res.setEncoding('utf8');
      res.on('data', (chunk: string) => (text += chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text ? (JSON.parse(text) as unknown) : null }));
    });
    req.on('error', reject);
  });
  response.catch(() => undefined);
  req.write(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${fileName}"\r\nContent-Type: application/pdf\r\n\r\n`);
  return {
    write: (bytes) => new Promise((resolve, reject) => req.write(bytes, (error) => (error ? reject(error) : resolve()))),
    finish: () => {
      req.end(`\r\n--${boundary}--\r\n`);
      return response;
    },
    abort: () => req.destroy(),
  };
}

/** Polls `check` until it returns true or `timeoutMs` passes; returns the last answer. */
export async function eventually(check: () => boolean | Promise<boolean>, timeoutMs = 5000): Promise<boolean> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 20));
  }
  return check();
}
