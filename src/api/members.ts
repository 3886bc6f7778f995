import type { AcceptInvitationInput, FarmRole, InviteInput } from '@shared/schema/accounts';
import type { AcceptedInvitation, FarmMember, InvitationPreview, MemberRoleChange, PendingInvitation } from '@shared/responses';
import { http } from './client';

export type { FarmMember, InvitationPreview, PendingInvitation };

/** A farm's members and the owner's invitations. */
export const membersApi = {
  list: (farmId: number) => http.get<FarmMember[]>(`/farms/${farmId}/members`),
  changeRole: (farmId: number, userId: number, role: FarmRole) => http.patch<MemberRoleChange>(`/farms/${farmId}/members/${userId}`, { role }),
  remove: (farmId: number, userId: number) => http.delete(`/farms/${farmId}/members/${userId}`),
  invitations: (farmId: number) => http.get<PendingInvitation[]>(`/farms/${farmId}/invitations`),
  invite: (farmId: number, input: InviteInput) => http.post<PendingInvitation>(`/farms/${farmId}/invitations`, input),
  resend: (farmId: number, invitationId: number) => http.post<PendingInvitation>(`/farms/${farmId}/invitations/${invitationId}/resend`),
  revoke: (farmId: number, invitationId: number) => http.delete(`/farms/${farmId}/invitations/${invitationId}`),
};

/** The invitee's side, by the token from the e-mailed link. */
export const invitationsApi = {
  preview: (token: string) => http.get<InvitationPreview>(`/invitations/${encodeURIComponent(token)}`),
  accept: (token: string, input: AcceptInvitationInput) =>
    http.post<AcceptedInvitation>(`/invitations/${encodeURIComponent(token)}/accept`, input),
};
