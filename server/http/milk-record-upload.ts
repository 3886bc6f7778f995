/**
 * Milk-record uploads over HTTP: a multer storage engine that stores nothing and parses the
 * upload while it streams in (papaparse step mode, nothing buffered beyond the reader's per-cow
 * and per-day totals), leaving the summary on the request for services/milk-records.ts.
 */
import type { Request } from 'express';
import type multer from 'multer';
import Papa from 'papaparse';
import { createMilkRecordReader, MilkRecordFileError, papaConfig, stepInto } from '../../shared/milk-records/parse.js';
import { AppError } from '../errors.js';
import type { ParsedMilkUpload } from '../services/milk-records.js';
import { sanitiseFileName } from './document-upload.js';

/**
 * A multer storage engine that stores nothing: it streams the upload through papaparse into
 * the milk-record reader and hands back the summary. A file without a usable header is a 400
 * naming the column.
 */
export function milkRecordEngine(): multer.StorageEngine {
  return {
    _handleFile(_req: Request, file, callback) {
      const reader = createMilkRecordReader();
      const feed = stepInto(reader);
      let settled = false;
      const settle = (error: unknown, result?: ParsedMilkUpload): void => {
        if (settled) return;
        settled = true;
        file.stream.resume();
        if (error) callback(error);
        else callback(null, result as unknown as Partial<Express.Multer.File>);
      };
      // Strings, not buffers: the decoder keeps a UTF-8 character split across chunks whole.
      file.stream.setEncoding('utf8');
      let first = true;
      let sawText = false;
      file.stream.on('data', (chunk: string) => {
        if (chunk.length > 0) sawText = true;
        if (first && chunk.includes('\u0000')) settle(new AppError(400, 'invalid_input', 'file: this is not a text (CSV) file', { file: 'Upload a CSV file' }));
        first = false;
      });
      Papa.parse<string[]>(file.stream, {
        ...papaConfig(),
        // A BOM stays on the first header name; findColumns ignores it.
        step: feed.step,
        complete: () => {
          const failure = feed.error();
          if (failure) return settle(fileError(failure));
          if (!sawText) return settle(fileError(new MilkRecordFileError('file', 'The file is empty')));
          settle(null, { fileName: sanitiseFileName(file.originalname), summary: reader.finish(feed.delimiter()) });
        },
        error: (error: Error) => settle(error),
      });
    },
    _removeFile(_req, _file, callback) {
      callback(null);
    },
  };
}

function fileError(error: MilkRecordFileError): AppError {
  return new AppError(400, 'invalid_input', `${error.field}: ${error.message}`, { [error.field]: error.message });
}

/** The parsed upload multer left on the request, or a 400 naming the `file` field. */
export function parsedMilkUpload(req: Request): ParsedMilkUpload | null {
  const file = req.file as unknown as ParsedMilkUpload | undefined;
  return file?.summary ? file : null;
}
