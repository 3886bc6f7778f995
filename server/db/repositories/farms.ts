import { eq } from 'drizzle-orm';
import type { Database } from '../client.js';
import { farmsTable, membershipsTable, type FarmRole } from '../schema/index.js';

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
