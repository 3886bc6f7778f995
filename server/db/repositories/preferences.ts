/** Preferences, decisions and the cached risk result of scenarios, as plain objects. */
import { and, desc, eq } from 'drizzle-orm';
import type { FarmRole } from '../schema/index.js';
import { membershipsTable, riskResultsTable, scenarioDecisionsTable, scenarioPreferencesTable, scenariosTable, usersTable } from '../schema/index.js';
import type { Executor } from './scenarios.js';

export interface PreferenceRecord {
  userId: number;
  name: string;
  /** The person's role on the scenario's farm; null if they have since left it. */
  role: FarmRole | null;
  optionId: string;
  reason: string;
  updatedAt: Date;
}

export interface DecisionRecord {
  id: number;
  optionId: string;
  optionName: string;
  decidedBy: { id: number; name: string } | null;
  decidedAt: Date;
  note: string;
  scenarioVersion: number;
}

export interface RiskResultRecord {
  inputsHash: string;
  scenarioVersion: number;
  result: unknown;
  savedBy: { id: number; name: string } | null;
  savedAt: Date;
}

function parseJson(value: unknown): unknown {
  return typeof value === 'string' ? JSON.parse(value) : value;
}

/** Every preference recorded on a scenario, oldest change first. */
export async function listPreferences(db: Executor, scenarioId: number): Promise<PreferenceRecord[]> {
  const rows = await db
    .select({ pref: scenarioPreferencesTable, name: usersTable.name, role: membershipsTable.role })
    .from(scenarioPreferencesTable)
    .innerJoin(usersTable, eq(usersTable.id, scenarioPreferencesTable.userId))
    .innerJoin(scenariosTable, eq(scenariosTable.id, scenarioPreferencesTable.scenarioId))
    .leftJoin(membershipsTable, and(eq(membershipsTable.userId, scenarioPreferencesTable.userId), eq(membershipsTable.farmId, scenariosTable.farmId)))
    .where(eq(scenarioPreferencesTable.scenarioId, scenarioId))
    .orderBy(scenarioPreferencesTable.updatedAt);
  return rows.map(({ pref, name, role }) => ({
    userId: pref.userId,
    name,
    role: role ?? null,
    optionId: pref.optionId,
    reason: pref.reason,
    updatedAt: pref.updatedAt,
  }));
}

/** Records or replaces one person's preference on a scenario. */
export async function upsertPreference(db: Executor, input: { scenarioId: number; userId: number; optionId: string; reason: string; now: Date }): Promise<void> {
  await db
    .insert(scenarioPreferencesTable)
    .values({ scenarioId: input.scenarioId, userId: input.userId, optionId: input.optionId, reason: input.reason, updatedAt: input.now })
    .onDuplicateKeyUpdate({ set: { optionId: input.optionId, reason: input.reason, updatedAt: input.now } });
}

/** Withdraws one person's preference; true when there was one. */
export async function deletePreference(db: Executor, scenarioId: number, userId: number): Promise<boolean> {
  const [result] = await db
    .delete(scenarioPreferencesTable)
    .where(and(eq(scenarioPreferencesTable.scenarioId, scenarioId), eq(scenarioPreferencesTable.userId, userId)));
  return result.affectedRows > 0;
}

/** Every decision on a scenario, newest first (the first is the decision in force). */
export async function listDecisions(db: Executor, scenarioId: number): Promise<DecisionRecord[]> {
  const rows = await db
    .select({ decision: scenarioDecisionsTable, name: usersTable.name })
    .from(scenarioDecisionsTable)
    .leftJoin(usersTable, eq(usersTable.id, scenarioDecisionsTable.decidedBy))
    .where(eq(scenarioDecisionsTable.scenarioId, scenarioId))
    .orderBy(desc(scenarioDecisionsTable.decidedAt), desc(scenarioDecisionsTable.id));
  return rows.map(({ decision, name }) => ({
    id: decision.id,
    optionId: decision.optionId,
    optionName: decision.optionName,
    decidedBy: decision.decidedBy !== null && name !== null ? { id: decision.decidedBy, name } : null,
    decidedAt: decision.decidedAt,
    note: decision.note,
    scenarioVersion: decision.scenarioVersion,
  }));
}

/** Inserts a decision record; returns its id. */
export async function insertDecision(
  db: Executor,
  input: { scenarioId: number; optionId: string; optionName: string; userId: number; note: string; scenarioVersion: number; now: Date },
): Promise<number> {
  const [result] = await db.insert(scenarioDecisionsTable).values({
    scenarioId: input.scenarioId,
    optionId: input.optionId,
    optionName: input.optionName,
    decidedBy: input.userId,
    decidedAt: input.now,
    note: input.note,
    scenarioVersion: input.scenarioVersion,
  });
  return result.insertId;
}

/** The cached Monte Carlo result of a scenario, or null. */
export async function findRiskResult(db: Executor, scenarioId: number): Promise<RiskResultRecord | null> {
  const [row] = await db
    .select({ risk: riskResultsTable, name: usersTable.name })
    .from(riskResultsTable)
    .leftJoin(usersTable, eq(usersTable.id, riskResultsTable.savedBy))
    .where(eq(riskResultsTable.scenarioId, scenarioId));
  if (!row) return null;
  const { risk, name } = row;
  return {
    inputsHash: risk.inputsHash,
    scenarioVersion: risk.scenarioVersion,
    result: parseJson(risk.result),
    savedBy: risk.savedBy !== null && name !== null ? { id: risk.savedBy, name } : null,
    savedAt: risk.savedAt,
  };
}

/** Keeps a Monte Carlo result as the scenario's one cached result, replacing any earlier one. */
export async function saveRiskResult(
  db: Executor,
  input: { scenarioId: number; inputsHash: string; scenarioVersion: number; result: unknown; userId: number; now: Date },
): Promise<void> {
  const values = {
    scenarioId: input.scenarioId,
    inputsHash: input.inputsHash,
    scenarioVersion: input.scenarioVersion,
    result: input.result,
    savedBy: input.userId,
    savedAt: input.now,
  };
  await db
    .insert(riskResultsTable)
    .values(values)
    .onDuplicateKeyUpdate({ set: { inputsHash: values.inputsHash, scenarioVersion: values.scenarioVersion, result: values.result, savedBy: values.savedBy, savedAt: values.savedAt } });
}
