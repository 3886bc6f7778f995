/** /api/farms/:farmId/milk-records…: preview an upload, confirm it into the baseline, list imports. */
import multer from 'multer';
import { milkRecordConfirmSchema } from '../../shared/schema/milk-records.js';
import type { AppDeps } from '../app.js';
import { farmAccess, type FarmRoute } from '../auth/middleware.js';
import { AppError, parseOrThrow } from '../errors.js';
import { milkRecordEngine, parsedMilkUpload } from '../http/milk-record-upload.js';
import { actorOf } from '../http/params.js';
import { confirmMilkRecords, MAX_MILK_RECORD_BYTES, milkRecordHistory, previewMilkRecords } from '../services/milk-records.js';
import { runUpload } from './documents.js';

export function milkRecordRoutes({ db }: AppDeps, route: FarmRoute): void {
  const upload = runUpload(
    multer({ storage: milkRecordEngine(), limits: { fileSize: MAX_MILK_RECORD_BYTES, files: 1, fields: 5, fieldSize: 200, parts: 6 } }).single('file'),
    MAX_MILK_RECORD_BYTES,
  );

  route('get', '/milk-records', 'baseline:read', async (req, res) => {
    res.json(await milkRecordHistory(db, farmAccess(req).farmId));
  });

  route('post', '/milk-records/preview', 'farm:update', upload, async (req, res) => {
    const parsed = parsedMilkUpload(req);
    if (!parsed) throw new AppError(400, 'invalid_input', 'file: choose a milk-record CSV file', { file: 'Choose a CSV file' });
    res.json(await previewMilkRecords(db, actorOf(req), parsed));
  });

  // The preview's token as JSON, or the file itself again as multipart.
  route('post', '/milk-records/confirm', 'farm:update', upload, async (req, res) => {
    const parsed = parsedMilkUpload(req);
    const source = parsed ? { upload: parsed } : parseOrThrow(milkRecordConfirmSchema, req.body);
    res.status(201).json(await confirmMilkRecords(db, actorOf(req), source));
  });
}
