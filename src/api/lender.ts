/** Lender shares: share a scenario version, list and revoke shares, the lender's own shares, the share link, the audit log. */
import type { CreateShareInput, SharePreview } from '@shared/schema/lender';
import type { AcceptedShare, AuditEntry, AuditPage, ShareState, ShareView } from '@shared/responses';
import type { AcceptInvitationInput } from '@shared/schema/accounts';
import { http } from './client';

export type { AcceptedShare, AuditEntry, AuditPage, SharePreview, ShareState };
/** A lender share as the API answers it. */
export type LenderShare = ShareView;

const farm = (farmId: number) => `/farms/${farmId}`;

export const lenderApi = {
  list: (farmId: number, scenarioId?: number) => http.get<LenderShare[]>(`${farm(farmId)}/lender-shares${scenarioId ? `?scenarioId=${scenarioId}` : ''}`),
  mine: (farmId: number) => http.get<LenderShare[]>(`${farm(farmId)}/lender-shares/mine`),
  create: (farmId: number, scenarioId: number, body: CreateShareInput) => http.post<LenderShare>(`${farm(farmId)}/scenarios/${scenarioId}/lender-shares`, body),
  revoke: (farmId: number, shareId: number) => http.post<LenderShare>(`${farm(farmId)}/lender-shares/${shareId}/revoke`),
  preview: (token: string) => http.get<SharePreview>(`/lender-shares/${encodeURIComponent(token)}`),
  accept: (token: string, input: AcceptInvitationInput) => http.post<AcceptedShare>(`/lender-shares/${encodeURIComponent(token)}/accept`, input),
  /** The lender workbook download (members: latest version; a lender: the version shared with them). */
  workbookUrl: (farmId: number, scenarioId: number) => `/api${farm(farmId)}/scenarios/${scenarioId}/workbook.xlsx`,
  auditLog: (farmId: number, before?: number) =>
    http.get<AuditPage>(`${farm(farmId)}/audit-log?limit=50${before ? `&before=${before}` : ''}`),
};
