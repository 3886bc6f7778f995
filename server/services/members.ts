/**
 * Farm members: listing, changing a role, removing. A farm keeps at least one owner at all
 * times; the check and the change run in one transaction over locked membership rows.
 */
import type { Database } from '../db/client.js';
import { deleteMembership, listMembers, lockMemberships, updateMemberRole, type Member } from '../db/repositories/farms.js';
import type { FarmRole } from '../db/schema/index.js';
import { AppError, notFound } from '../errors.js';

export const LAST_OWNER_MESSAGE = 'A farm needs at least one owner. Make someone else an owner first.';

const lastOwner = (field: string) => new AppError(409, 'last_owner', LAST_OWNER_MESSAGE, { [field]: LAST_OWNER_MESSAGE });

export async function farmMembers(db: Database, farmId: number): Promise<Member[]> {
  return listMembers(db, farmId);
}

/** Sets a member's role; 404 for someone not on the farm, 409 when it would leave no owner. */
export async function changeMemberRole(db: Database, farmId: number, userId: number, role: FarmRole): Promise<void> {
  await db.transaction(async (tx) => {
    const rows = await lockMemberships(tx, farmId);
    const target = rows.find((r) => r.userId === userId);
    if (!target) throw notFound('That person is not a member of this farm');
    if (target.role === role) return;
    const owners = rows.filter((r) => r.role === 'owner').length;
    if (target.role === 'owner' && owners <= 1) throw lastOwner('role');
    await updateMemberRole(tx, farmId, userId, role);
  });
}

/** Removes a member; 404 for someone not on the farm, 409 for the last owner. */
export async function removeMember(db: Database, farmId: number, userId: number): Promise<void> {
  await db.transaction(async (tx) => {
    const rows = await lockMemberships(tx, farmId);
    const target = rows.find((r) => r.userId === userId);
    if (!target) throw notFound('That person is not a member of this farm');
    const owners = rows.filter((r) => r.role === 'owner').length;
    if (target.role === 'owner' && owners <= 1) throw lastOwner('userId');
    await deleteMembership(tx, farmId, userId);
  });
}
