/** A farm's baseline (herd and markets JSON) and display settings. */
import { eq } from 'drizzle-orm';
import type { Database } from '../client.js';
import { farmsTable } from '../schema/index.js';

export interface FarmBaselineRecord {
  /** The herd shape of shared/schema as stored; null until someone sets it. */
  herd: unknown;
  currency: string;
  locale: string;
  units: 'metric' | 'us';
}

export async function findFarmBaseline(db: Database, farmId: number): Promise<FarmBaselineRecord | null> {
  const [row] = await db
    .select({ herd: farmsTable.baseline, currency: farmsTable.currency, locale: farmsTable.locale, units: farmsTable.units })
    .from(farmsTable)
    .where(eq(farmsTable.id, farmId));
  if (!row) return null;
  // MariaDB returns JSON columns as text.
  return { ...row, herd: typeof row.herd === 'string' ? JSON.parse(row.herd) : row.herd };
}

export async function updateFarmBaseline(db: Database, farmId: number, baseline: FarmBaselineRecord): Promise<void> {
  await db
    .update(farmsTable)
    .set({ baseline: baseline.herd, currency: baseline.currency, locale: baseline.locale, units: baseline.units })
    .where(eq(farmsTable.id, farmId));
}
