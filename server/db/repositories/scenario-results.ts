/** Kept results per scenario version and engine key, as the JSON text they are sent in. */
import { and, eq, ne, sql } from 'drizzle-orm';
import { scenarioResultsTable, scenariosTable } from '../schema/index.js';
import type { Executor } from './scenarios.js';

export interface KeptResults {
  name: string;
  document: string;
  summary: string;
  /** Null until first asked for, for a version kept at save (see keepSavedResults). */
  detail: string | null;
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

/** Keeps one version's results (a second writer of the same key changes nothing) and drops that version's rows under other keys. */
export async function keepResults(db: Executor, input: KeptResults & { scenarioId: number; version: number; engineKey: string }): Promise<void> {
  await db
    .insert(scenarioResultsTable)
    .values(input)
    .onDuplicateKeyUpdate({ set: { engineKey: input.engineKey } });
  await db
    .delete(scenarioResultsTable)
    .where(and(eq(scenarioResultsTable.scenarioId, input.scenarioId), eq(scenarioResultsTable.version, input.version), ne(scenarioResultsTable.engineKey, input.engineKey)));
}

/**
 * Keeps the results of the version the scenario row holds, as just saved in this transaction: name
 * and document are copied from that row inside the database (sent once, with the row), and the
 * yearly lines and loan payments are left for the first read that asks for them (keepDetail):
 * they are twice the size of everything else, and most saves are never followed by that read
 * from another process.
 */
export async function keepSavedResults(tx: Executor, scenarioId: number, engineKey: string, summary: string): Promise<void> {
  await tx.insert(scenarioResultsTable).select(
    tx
      .select({
        scenarioId: scenariosTable.id,
        version: scenariosTable.version,
        engineKey: sql`${engineKey}`.as('engine_key'),
        name: scenariosTable.name,
        document: scenariosTable.document,
        summary: sql`${summary}`.as('summary'),
        detail: sql`null`.as('detail'),
        createdAt: scenariosTable.updatedAt,
      })
      .from(scenariosTable)
      .where(eq(scenariosTable.id, scenarioId)),
  );
}

/** Fills in the yearly lines and loan payments of a version kept without them. */
export async function keepDetail(db: Executor, scenarioId: number, version: number, engineKey: string, detail: string): Promise<void> {
  await db
    .update(scenarioResultsTable)
    .set({ detail })
    .where(and(eq(scenarioResultsTable.scenarioId, scenarioId), eq(scenarioResultsTable.version, version), eq(scenarioResultsTable.engineKey, engineKey)));
}
