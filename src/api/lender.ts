/** Lender shares: share a scenario version, list and revoke shares, the lender's own shares, the share link, the audit log. */
import type { ReviewStatusValue, SharePreview } from '@shared/schema/lender';

export type { SharePreview };
import type { AcceptInvitationInput } from '@shared/schema/accounts';
import type { Session } from './auth';
import { http } from './client';

export type ShareState = 'pending' | 'live' | 'revoked' | 'expired';

export interface LenderShare {
  id: number;
  scenarioId: number;
  scenarioName: string;
  version: number;
  lenderEmail: string;
  lenderName: string | null;
  state: ShareState;
  /** YYYY-MM-DD: from this date (UTC) the share no longer opens. */
  expiresOn: string;
  acceptedAt: string | null;
  revokedAt: string | null;
  reviewStatus: ReviewStatusValue;
  reviewStatusAt: string | null;
  reviewStatusBy: string | null;
  sharedBy: string | null;
  createdAt: string;
}

export interface CreateShareBody {
  email: string;
  version?: number;
  expiresOn: string;
  message?: string;
}


export interface AcceptedShare extends Session {
  farmId: number;
  scenarioId: number;
  shareId: number;
}

export interface AuditEntry {
  id: number;
  actor: string;
  action: string;
  description: string;
  subject: string;
  detail: Record<string, unknown>;
  createdAt: string;
}

const farm = (farmId: number) => `/farms/${farmId}`;

export const lenderApi = {
  list: (farmId: number, scenarioId?: number) => http.get<LenderShare[]>(`${farm(farmId)}/lender-shares${scenarioId ? `?scenarioId=${scenarioId}` : ''}`),
  mine: (farmId: number) => http.get<LenderShare[]>(`${farm(farmId)}/lender-shares/mine`),
  create: (farmId: number, scenarioId: number, body: CreateShareBody) => http.post<LenderShare>(`${farm(farmId)}/scenarios/${scenarioId}/lender-shares`, body),
  revoke: (farmId: number, shareId: number) => http.post<LenderShare>(`${farm(farmId)}/lender-shares/${shareId}/revoke`),
  preview: (token: string) => http.get<SharePreview>(`/lender-shares/${encodeURIComponent(token)}`),
  accept: (token: string, input: AcceptInvitationInput) => http.post<AcceptedShare>(`/lender-shares/${encodeURIComponent(token)}/accept`, input),
  /** The lender workbook download (members: latest version; a lender: the version shared with them). */
  workbookUrl: (farmId: number, scenarioId: number) => `/api${farm(farmId)}/scenarios/${scenarioId}/workbook.xlsx`,
  auditLog: (farmId: number, before?: number) =>
    http.get<{ entries: AuditEntry[]; nextBefore: number | null }>(`${farm(farmId)}/audit-log?limit=50${before ? `&before=${before}` : ''}`),
};
