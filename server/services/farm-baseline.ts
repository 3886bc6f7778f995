/** The farm baseline: the herd and markets new scenarios start from, and how the farm shows figures. */
import type { z } from 'zod';
import type { baselineBodySchema } from '../../shared/schema/requests.js';
import { herdSchema } from '../../shared/schema/index.js';
import type { FarmBaseline } from '../../shared/responses.js';
import type { Database } from '../db/client.js';
import { findFarmBaseline, updateFarmBaseline } from '../db/repositories/farm-baseline.js';
import { notFound } from '../errors.js';

export async function readBaseline(db: Database, farmId: number): Promise<FarmBaseline> {
  const found = await findFarmBaseline(db, farmId);
  if (!found) throw notFound('Farm not found');
  // A stored herd that no longer validates (the schema grew) is shown as missing rather than half-filled.
  const herd = herdSchema.safeParse(found.herd);
  return { herd: herd.success ? herd.data : null, currency: found.currency, locale: found.locale, units: found.units };
}

/** Replaces the baseline; existing scenarios keep their own copy of the herd. */
export async function saveBaseline(db: Database, farmId: number, input: z.output<typeof baselineBodySchema>): Promise<FarmBaseline> {
  await updateFarmBaseline(db, farmId, input);
  return readBaseline(db, farmId);
}
