/** Milk-record import: preview an upload, confirm it into the herd baseline, list past imports. */
import type { MilkRecordImport, MilkRecordPreview } from '@shared/schema/milk-records';
import type { MilkRecordHistory } from '@shared/responses';
import { http } from './client';
import { uploadWithProgress, type UploadProgress } from './documents';

export type { MilkRecordHistory, MilkRecordImport, MilkRecordPreview };

const base = (farmId: number) => `/farms/${farmId}/milk-records`;

export const milkRecordsApi = {
  history: (farmId: number) => http.get<MilkRecordHistory>(base(farmId)),
  preview(farmId: number, file: File, onProgress?: UploadProgress): Promise<MilkRecordPreview> {
    const form = new FormData();
    form.append('file', file);
    return uploadWithProgress<MilkRecordPreview>(`${base(farmId)}/preview`, form, onProgress);
  },
  confirm: (farmId: number, token: string) => http.post<MilkRecordImport>(`${base(farmId)}/confirm`, { token }),
};
