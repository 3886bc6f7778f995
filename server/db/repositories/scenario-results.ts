/** Kept results per scenario version and engine key, as the JSON text they are sent in. */
import { and, eq, ne } from 'drizzle-orm';
import { scenarioResultsTable } from '../schema/index.js';
import type { Executor } from './scenarios.js';

export interface KeptResults {
  name: string;
  document: string;
  summary: string;
  detail: string;
}

/** The kept texts of one version under `engineKey`, only the columns asked for; null when none. */
export async function findKeptResults<K extends keyof KeptResults>(
  db: Executor,
  scenarioId: number,
  version: number,
  engineKey: string,
  columns: readonly K[],
): Promise<Pick<KeptResults, K> | null> {
  const wanted = Object.fromEntries(columns.map((c) => [c, scenarioResultsTable[c]])) as Record<K, (typeof scenarioResultsTable)[K]>;
  const [row] = await db
    .select(wanted)
    .from(scenarioResultsTable)
    .where(and(eq(scenarioResultsTable.scenarioId, scenarioId), eq(scenarioResultsTable.version, version), eq(scenarioResultsTable.engineKey, engineKey)));
  return (row as Pick<KeptResults, K> | undefined) ?? null;
}

/**
 * Keeps one version's results (a second writer of the same key changes nothing) and drops that
 * version's rows under other keys; `newVersion` (a version written in this same transaction, so
 * it has no rows yet) skips that delete.
 */
export async function keepResults(db: Executor, input: KeptResults & { scenarioId: number; version: number; engineKey: string }, newVersion = false): Promise<void> {
  await db
    .insert(scenarioResultsTable)
    .values(input)
    .onDuplicateKeyUpdate({ set: { engineKey: input.engineKey } });
  if (newVersion) return;
  await db
    .delete(scenarioResultsTable)
    .where(and(eq(scenarioResultsTable.scenarioId, input.scenarioId), eq(scenarioResultsTable.version, input.version), ne(scenarioResultsTable.engineKey, input.engineKey)));
}
