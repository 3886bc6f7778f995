/** Review notes and review status of lender shares. */
import type { CreateNoteInput, ReviewStatusValue } from '@shared/schema/lender';
import type { FarmRole } from '@shared/schema/accounts';
import { http } from './client';
import type { LenderShare } from './lender';

export interface ReviewNote {
  id: number;
  author: string | null;
  authorRole: FarmRole;
  optionId: string | null;
  optionName: string | null;
  lineRef: string | null;
  body: string;
  createdAt: string;
}

export interface ReviewThread extends ReviewNote {
  replies: ReviewNote[];
}

export interface ShareReview {
  share: LenderShare;
  notes: ReviewThread[];
}

const share = (farmId: number, shareId: number) => `/farms/${farmId}/lender-shares/${shareId}`;

export const reviewsApi = {
  ofScenario: (farmId: number, scenarioId: number) => http.get<ShareReview[]>(`/farms/${farmId}/scenarios/${scenarioId}/reviews`),
  addNote: (farmId: number, shareId: number, body: CreateNoteInput) => http.post<ReviewNote>(`${share(farmId, shareId)}/notes`, body),
  reply: (farmId: number, shareId: number, noteId: number, body: string) => http.post<ReviewNote>(`${share(farmId, shareId)}/notes/${noteId}/replies`, { body }),
  setStatus: (farmId: number, shareId: number, status: ReviewStatusValue) => http.put<LenderShare>(`${share(farmId, shareId)}/status`, { status }),
};
