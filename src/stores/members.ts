/** One farm's members and open invitations, for the members screen; the farm itself is the farm store's. */
import { defineStore } from 'pinia';
import { readonly, ref } from 'vue';
import { membersApi, type FarmMember, type PendingInvitation } from '@/api/members';
import type { FarmRole, InviteInput } from '@shared/schema/accounts';
import { useFarmStore } from './farm';

export const useMembersStore = defineStore('farm-members', () => {
  const farm = useFarmStore();
  const farmId = ref<number | null>(null);
  const members = ref<FarmMember[]>([]);
  const invitations = ref<PendingInvitation[]>([]);

  async function load(id: number): Promise<void> {
    if (farmId.value !== id) {
      members.value = [];
      invitations.value = [];
    }
    farmId.value = id;
    const [, list] = await Promise.all([farm.load(id), membersApi.list(id)]);
    if (farm.loadError) throw new Error(farm.loadError);
    members.value = list;
    invitations.value = farm.can('members:manage') ? await membersApi.invitations(id) : [];
  }

  function requireFarm(): number {
    if (farmId.value === null) throw new Error('members store used before load');
    return farmId.value;
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

  return { members: readonly(members), invitations: readonly(invitations), load, invite, resend, revoke, changeRole, remove };
});

/** How each farm role is named on screen (docs/product.md's words). */
export const roleLabels: Record<FarmRole, string> = {
  owner: 'Owner',
  partner: 'Family partner',
  consultant: 'Consultant',
  lender: 'Loan officer (read-only)',
};
