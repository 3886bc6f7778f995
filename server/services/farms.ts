/** The caller's farms: listing, creating one (the creator becomes its owner), and one farm's details. */
import type { FarmDetail, FarmSummary } from '../../shared/responses.js';
import type { CreateFarmInput, FarmRole } from '../../shared/schema/accounts.js';
import { roleAllows } from '../../shared/permissions.js';
import type { Database } from '../db/client.js';
import { findFarm, insertFarmWithOwner, listFarmsOfUser } from '../db/repositories/farms.js';
import { notFound } from '../errors.js';

export async function farmsOf(db: Database, userId: number): Promise<FarmSummary[]> {
  const farms = await listFarmsOfUser(db, userId);
  return farms.map(({ id, name, location, role, currency, units }) => ({ id, name, location, role, currency, units }));
}

/** Creates a farm owned by `userId`; answers the farm as the creator's list shows it. */
export async function createFarm(db: Database, userId: number, input: CreateFarmInput): Promise<FarmSummary & { locale: string }> {
  const id = await insertFarmWithOwner(db, input, userId);
  return { id, ...input, role: 'owner' };
}

export async function farmDetail(db: Database, farmId: number, role: FarmRole): Promise<FarmDetail> {
  const farm = await findFarm(db, farmId);
  if (!farm) throw notFound('Farm not found');
  // A lender sees the farm's name, not its herd baseline.
  return { ...farm, baseline: roleAllows(role, 'baseline:read') ? farm.baseline : null, createdAt: farm.createdAt.toISOString(), role };
}
