/** Review notes and review status of lender shares. */
import type { CreateNoteInput, ReviewStatusValue } from '@shared/schema/lender';
import { http } from './client';
import type { LenderShare } from './lender';
import type { ReviewNote, ReviewThread, ShareReview } from '@shared/responses';

export type { ReviewNote, ReviewThread, ShareReview };

const share = (farmId: number, shareId: number) => `/farms/${farmId}/lender-shares/${shareId}`;

export const reviewsApi = {
  ofScenario: (farmId: number, scenarioId: number) => http.get<ShareReview[]>(`/farms/${farmId}/scenarios/${scenarioId}/reviews`),
  addNote: (farmId: number, shareId: number, body: CreateNoteInput) => http.post<ReviewNote>(`${share(farmId, shareId)}/notes`, body),
  reply: (farmId: number, shareId: number, noteId: number, body: string) => http.post<ReviewNote>(`${share(farmId, shareId)}/notes/${noteId}/replies`, { body }),
  setStatus: (farmId: number, shareId: number, status: ReviewStatusValue) => http.put<LenderShare>(`${share(farmId, shareId)}/status`, { status }),
};
