import { and, eq } from 'drizzle-orm';
import type { Database } from '../client.js';
import { farmsTable, membershipsTable, usersTable, type FarmRole } from '../schema/index.js';

export interface Farm {
  id: number;
  name: string;
  location: string;
  currency: string;
  locale: string;
  units: 'metric' | 'us';
  baseline: unknown;
  createdAt: Date;
}

export async function listFarmsOfUser(db: Database, userId: number): Promise<(Farm & { role: FarmRole })[]> {
  const rows = await db
    .select({ farm: farmsTable, role: membershipsTable.role })
    .from(membershipsTable)
    .innerJoin(farmsTable, eq(farmsTable.id, membershipsTable.farmId))
    .where(eq(membershipsTable.userId, userId))
    .orderBy(farmsTable.name);
  return rows.map((r) => ({ ...r.farm, role: r.role }));
}

export async function findFarm(db: Database, farmId: number): Promise<Farm | null> {
  const [row] = await db.select().from(farmsTable).where(eq(farmsTable.id, farmId));
  return row ?? null;
}

/** Creates the farm and its first owner in one transaction (a farm always has an owner). */
export async function insertFarmWithOwner(
  db: Database,
  farm: { name: string; location: string; currency: string; locale: string; units: 'metric' | 'us'; baseline?: unknown },
  ownerId: number,
): Promise<number> {
  return db.transaction(async (tx) => {
    const [result] = await tx.insert(farmsTable).values(farm);
    await tx.insert(membershipsTable).values({ farmId: result.insertId, userId: ownerId, role: 'owner' });
    return result.insertId;
  });
}

/** A connection or an open transaction: member changes that check the owner count run in one. */
export type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

export interface Member {
  userId: number;
  name: string;
  email: string;
  role: FarmRole;
  since: Date;
}

export async function listMembers(db: Executor, farmId: number): Promise<Member[]> {
  return db
    .select({
      userId: usersTable.id,
      name: usersTable.name,
      email: usersTable.email,
      role: membershipsTable.role,
      since: membershipsTable.createdAt,
    })
    .from(membershipsTable)
    .innerJoin(usersTable, eq(usersTable.id, membershipsTable.userId))
    .where(eq(membershipsTable.farmId, farmId))
    .orderBy(usersTable.name);
}

/**
 * The farm's memberships, locked until the transaction ends (SELECT … FOR UPDATE), so two
 * owners demoting each other at once cannot leave the farm without an owner.
 */
export async function lockMemberships(tx: Executor, farmId: number): Promise<{ userId: number; role: FarmRole }[]> {
  return tx
    .select({ userId: membershipsTable.userId, role: membershipsTable.role })
    .from(membershipsTable)
    .where(eq(membershipsTable.farmId, farmId))
    .for('update');
}

/** Adds the membership, or changes the role of an existing one. */
export async function upsertMembership(db: Executor, farmId: number, userId: number, role: FarmRole): Promise<void> {
  await db.insert(membershipsTable).values({ farmId, userId, role }).onDuplicateKeyUpdate({ set: { role } });
}

export async function updateMemberRole(db: Executor, farmId: number, userId: number, role: FarmRole): Promise<void> {
  await db
    .update(membershipsTable)
    .set({ role })
    .where(and(eq(membershipsTable.farmId, farmId), eq(membershipsTable.userId, userId)));
}

export async function deleteMembership(db: Executor, farmId: number, userId: number): Promise<void> {
  await db.delete(membershipsTable).where(and(eq(membershipsTable.farmId, farmId), eq(membershipsTable.userId, userId)));
}
