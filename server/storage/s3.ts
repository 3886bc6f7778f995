/**
 * Files in an S3-compatible object store through @aws-sdk/client-s3. Small files go up in one
 * PutObject; larger ones as a multipart upload that is aborted if the stream fails, so an
 * interrupted upload leaves no object behind.
 */
import type { Readable } from 'node:stream';
import {
  AbortMultipartUploadCommand,
  CompleteMultipartUploadCommand,
  CreateMultipartUploadCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  UploadPartCommand,
} from '@aws-sdk/client-s3';
import type { StorageConfig } from '../config.js';
import { isStorageKey, newStorageKey, StoredFileMissingError, type FileStorage } from './index.js';

/** S3's smallest part except the last is 5 MiB; 8 MiB keeps a 15 MB upload to two parts. */
const PART_BYTES = 8 * 1024 * 1024;

type S3Settings = Extract<StorageConfig, { kind: 's3' }>;

/** Storage in `settings.bucket`; path-style addressing when an endpoint is given (S3-compatible stores). */
export function createS3Storage(settings: S3Settings): FileStorage {
  const client = new S3Client({
    region: settings.region,
    ...(settings.endpoint ? { endpoint: settings.endpoint, forcePathStyle: true } : {}),
    ...(settings.accessKeyId && settings.secretAccessKey
      ? { credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } }
      : {}),
    // Bodies are buffers of known length: no streamed checksums, which many S3-compatible stores refuse.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = settings.bucket;

  async function multipart(Key: string, first: Buffer, rest: AsyncIterator<Buffer>): Promise<void> {
    const { UploadId } = await client.send(new CreateMultipartUploadCommand({ Bucket, Key }));
    if (!UploadId) throw new Error('The object store gave no upload id');
    try {
      const parts: { ETag: string | undefined; PartNumber: number }[] = [];
      let body: Buffer | null = first;
      while (body) {
        const PartNumber = parts.length + 1;
        const { ETag } = await client.send(new UploadPartCommand({ Bucket, Key, UploadId, PartNumber, Body: body }));
        parts.push({ ETag, PartNumber });
        const next = await rest.next();
        body = next.done ? null : next.value;
      }
      await client.send(new CompleteMultipartUploadCommand({ Bucket, Key, UploadId, MultipartUpload: { Parts: parts } }));
    } catch (error) {
      await client.send(new AbortMultipartUploadCommand({ Bucket, Key, UploadId })).catch(() => undefined);
      throw error;
    }
  }

  return {
    async put(stream) {
      const Key = newStorageKey();
      const parts = chunked(stream, PART_BYTES)[Symbol.asyncIterator]();
      const first = await parts.next();
      const firstPart = first.done ? Buffer.alloc(0) : first.value;
      if (firstPart.length < PART_BYTES) {
        await client.send(new PutObjectCommand({ Bucket, Key, Body: firstPart, ContentLength: firstPart.length }));
      } else {
        await multipart(Key, firstPart, parts);
      }
      return Key;
    },
    async get(Key) {
      if (!isStorageKey(Key)) throw new StoredFileMissingError(Key);
      try {
        const { Body } = await client.send(new GetObjectCommand({ Bucket, Key }));
        if (!Body) throw new StoredFileMissingError(Key);
        return Body as Readable;
      } catch (error) {
        if (error instanceof NoSuchKey || (error as { name?: string }).name === 'NoSuchKey') throw new StoredFileMissingError(Key);
        throw error;
      }
    },
    async delete(Key) {
      if (!isStorageKey(Key)) return;
      await client.send(new DeleteObjectCommand({ Bucket, Key }));
    },
  };
}

/** Regroups a byte stream into buffers of exactly `size` bytes (the last may be shorter). */
async function* chunked(stream: Readable, size: number): AsyncGenerator<Buffer> {
  let pending: Buffer[] = [];
  let length = 0;
  let yielded = false;
  for await (const chunk of stream) {
    let data = Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk as string);
    while (length + data.length >= size) {
      const take = size - length;
      pending.push(data.subarray(0, take));
      yield Buffer.concat(pending);
      yielded = true;
      data = data.subarray(take);
      pending = [];
      length = 0;
    }
    if (data.length > 0) {
      pending.push(data);
      length += data.length;
    }
  }
  if (length > 0 || !yielded) yield Buffer.concat(pending);
}
