/** One farm's members and open invitations, for the owner's members screen. */
import { defineStore } from 'pinia';
import { readonly, ref } from 'vue';
import { farmsApi, type FarmSummary } from '@/api/farms';
import { membersApi, type FarmMember, type PendingInvitation } from '@/api/members';
import { roleAllows } from '@shared/permissions';
import type { FarmRole, InviteInput } from '@shared/schema/accounts';

export const useMembersStore = defineStore('farm-members', () => {
  const farm = ref<FarmSummary | null>(null);
  const members = ref<FarmMember[]>([]);
  const invitations = ref<PendingInvitation[]>([]);

  async function load(farmId: number): Promise<void> {
    if (farm.value?.id !== farmId) {
      farm.value = null;
      members.value = [];
      invitations.value = [];
    }
    const [detail, list] = await Promise.all([farmsApi.get(farmId), membersApi.list(farmId)]);
    farm.value = detail;
    members.value = list;
    invitations.value = roleAllows(detail.role, 'members:manage') ? await membersApi.invitations(farmId) : [];
  }

  function requireFarm(): number {
    if (!farm.value) throw new Error('members store used before load');
    return farm.value.id;
  }

  async function invite(input: InviteInput): Promise<void> {
    const farmId = requireFarm();
    await membersApi.invite(farmId, input);
    invitations.value = await membersApi.invitations(farmId);
  }

  async function resend(invitationId: number): Promise<void> {
    const farmId = requireFarm();
    await membersApi.resend(farmId, invitationId);
    invitations.value = await membersApi.invitations(farmId);
  }

  async function revoke(invitationId: number): Promise<void> {
    const farmId = requireFarm();
    await membersApi.revoke(farmId, invitationId);
    invitations.value = invitations.value.filter((i) => i.id !== invitationId);
  }

  async function changeRole(userId: number, role: FarmRole): Promise<void> {
    const farmId = requireFarm();
    await membersApi.changeRole(farmId, userId, role);
    members.value = await membersApi.list(farmId);
  }

  async function remove(userId: number): Promise<void> {
    const farmId = requireFarm();
    await membersApi.remove(farmId, userId);
    members.value = members.value.filter((m) => m.userId !== userId);
  }

  return { farm: readonly(farm), members: readonly(members), invitations: readonly(invitations), load, invite, resend, revoke, changeRole, remove };
});

/** How each farm role is named on screen (docs/product.md's words). */
export const roleLabels: Record<FarmRole, string> = {
  owner: 'Owner',
  partner: 'Family partner',
  consultant: 'Consultant',
  lender: 'Loan officer (read-only)',
};
