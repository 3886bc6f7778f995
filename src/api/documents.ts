/** Documents of a farm, a scenario or a capital line: list, upload with progress, quote amounts, delete. */
import type { CapitalLineQuotes, DocumentTarget, DocumentView } from '@shared/schema/documents';
import { ApiError, http, type ApiErrorBody } from './client';

export type { CapitalLineQuotes, DocumentTarget, DocumentView };

const base = (farmId: number) => `/farms/${farmId}/documents`;

/** Bytes sent so far and the total, for a progress bar. */
export type UploadProgress = (sent: number, total: number) => void;

/**
 * Posts multipart `form` to an API path with XMLHttpRequest, because fetch reports no upload
 * progress. Resolves with the JSON answer; rejects with ApiError like every other call.
 */
export function uploadWithProgress<T>(path: string, form: FormData, onProgress?: UploadProgress): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api${path}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress?.(event.loaded, event.total);
    };
    xhr.onerror = () => reject(new ApiError(0, { code: 'network', message: 'Cannot reach Byrecast. Check your connection and try again.' }));
    xhr.onload = () => {
      let data: unknown;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        data = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(data as T);
      const error = (data as { error?: ApiErrorBody } | undefined)?.error ?? { code: `http_${xhr.status}`, message: `The server answered ${xhr.status}` };
      reject(new ApiError(xhr.status, error));
    };
    xhr.send(form);
  });
}

function query(target: DocumentTarget): string {
  const params = new URLSearchParams();
  if (target.scenarioId !== undefined) params.set('scenarioId', String(target.scenarioId));
  if (target.capitalLineId !== undefined) params.set('capitalLineId', target.capitalLineId);
  const text = params.toString();
  return text ? `?${text}` : '';
}

export const documentsApi = {
  list: (farmId: number, target: DocumentTarget = {}) => http.get<DocumentView[]>(`${base(farmId)}${query(target)}`),
  upload(farmId: number, file: File, target: DocumentTarget = {}, onProgress?: UploadProgress): Promise<DocumentView> {
    const form = new FormData();
    if (target.scenarioId !== undefined) form.append('scenarioId', String(target.scenarioId));
    if (target.capitalLineId !== undefined) form.append('capitalLineId', target.capitalLineId);
    form.append('file', file);
    return uploadWithProgress<DocumentView>(base(farmId), form, onProgress);
  },
  /** Where the browser downloads the file (served as an attachment). */
  downloadUrl: (farmId: number, id: number) => `/api${base(farmId)}/${id}/download`,
  setQuoteAmount: (farmId: number, id: number, quoteAmount: number | null) => http.patch<DocumentView>(`${base(farmId)}/${id}`, { quoteAmount }),
  remove: (farmId: number, id: number) => http.delete(`${base(farmId)}/${id}`),
  /** Per capital line of the scenario: its documents and whether a quote amount backs it. */
  quotes: (farmId: number, scenarioId: number) => http.get<{ lines: CapitalLineQuotes[] }>(`/farms/${farmId}/scenarios/${scenarioId}/quotes`),
};
