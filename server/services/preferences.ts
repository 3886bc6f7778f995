/**
 * Preferences, decisions and the cached risk result of a scenario. A preference or decision
 * must name an option of the scenario's latest version; a risk result is kept only for the
 * version it was run on, with the hash of its inputs, and reported stale once they change.
 */
import type { MonteCarloResult } from '../../shared/engine/risk/monte-carlo.js';
import type { Decision, PreferencesView, RiskResultView } from '../../shared/responses.js';
import type { Database } from '../db/client.js';
import {
  deletePreference,
  findRiskResult,
  insertDecision,
  listDecisions,
  listPreferences,
  saveRiskResult,
  upsertPreference,
} from '../db/repositories/preferences.js';
import { findScenario, setScenarioStatus, type ScenarioRecord } from '../db/repositories/scenarios.js';
import { AppError, conflict, notFound } from '../errors.js';
import { riskInputsHash } from './risk-inputs-hash.js';
import { accessOf, canSeeScenario, type Actor as ScenarioActor } from './access.js';
import { visibleRecord } from './scenarios.js';

async function visibleScenario(db: Database, actor: ScenarioActor, scenarioId: number): Promise<ScenarioRecord> {
  const record = canSeeScenario(await accessOf(db, actor), scenarioId) ? await findScenario(db, actor.farmId, scenarioId) : null;
  if (!record) throw notFound('Scenario not found');
  return record;
}

function optionOf(record: ScenarioRecord, optionId: string): { id: string; name: string } {
  const option = (record.document).options.find((o) => o.id === optionId);
  if (!option) {
    throw new AppError(400, 'invalid_input', `optionId: no option "${optionId}" in this scenario`, { optionId: `No option "${optionId}" in this scenario` });
  }
  return option;
}

/** Every member's preference on the scenario and the decision, if any. */
export async function readPreferences(db: Database, actor: ScenarioActor, scenarioId: number): Promise<PreferencesView> {
  await visibleScenario(db, actor, scenarioId);
  const [preferences, decisions] = await Promise.all([listPreferences(db, scenarioId), listDecisions(db, scenarioId)]);
  const dated = decisions.map((d): Decision => ({ ...d, decidedAt: d.decidedAt.toISOString() }));
  return {
    preferences: preferences.map((p) => ({ ...p, updatedAt: p.updatedAt.toISOString() })),
    decision: dated[0] ?? null,
    earlierDecisions: dated.slice(1),
  };
}

/** Records (or replaces) the caller's own preference. */
export async function recordPreference(db: Database, actor: ScenarioActor, scenarioId: number, input: { optionId: string; reason: string }): Promise<PreferencesView> {
  const record = await visibleScenario(db, actor, scenarioId);
  optionOf(record, input.optionId);
  await upsertPreference(db, { scenarioId, userId: actor.userId, optionId: input.optionId, reason: input.reason, now: new Date() });
  return readPreferences(db, actor, scenarioId);
}

/** Withdraws the caller's own preference; 404 when there was none. */
export async function withdrawPreference(db: Database, actor: ScenarioActor, scenarioId: number): Promise<PreferencesView> {
  await visibleScenario(db, actor, scenarioId);
  if (!(await deletePreference(db, scenarioId, actor.userId))) throw notFound('You have no preference on this scenario');
  return readPreferences(db, actor, scenarioId);
}

/** Marks the scenario decided with the chosen option: a new decision record, status 'decided'. */
export async function decide(db: Database, actor: ScenarioActor, scenarioId: number, input: { optionId: string; note: string }): Promise<PreferencesView> {
  const record = await visibleScenario(db, actor, scenarioId);
  const option = optionOf(record, input.optionId);
  await db.transaction(async (tx) => {
    await insertDecision(tx, { scenarioId, optionId: option.id, optionName: option.name, userId: actor.userId, note: input.note, scenarioVersion: record.version, now: new Date() });
    await setScenarioStatus(tx, actor.farmId, scenarioId, 'decided');
  });
  return readPreferences(db, actor, scenarioId);
}

/**
 * The cached Monte Carlo result, with whether it still matches the scenario as the caller sees it;
 * null when none was kept. A lender reads the shared version, so a run on inputs they were not
 * shared (a later save) is withheld from them rather than shown as stale.
 */
export async function readRiskResult(db: Database, actor: ScenarioActor, scenarioId: number): Promise<RiskResultView | null> {
  const record = await visibleRecord(db, actor, scenarioId);
  const saved = await findRiskResult(db, scenarioId);
  if (!saved) return null;
  const fresh = saved.inputsHash === riskInputsHash(record.document);
  if (!fresh && actor.role === 'lender') return null;
  return {
    // Checked for shape when it was kept (the route's riskResultBodySchema) and stored whole.
    result: saved.result as MonteCarloResult,
    scenarioVersion: saved.scenarioVersion,
    inputsHash: saved.inputsHash,
    fresh,
    savedBy: saved.savedBy?.name ?? null,
    savedAt: saved.savedAt.toISOString(),
  };
}

/** Keeps a Monte Carlo result run on `scenarioVersion`; 409 when the scenario was saved since. */
export async function keepRiskResult(db: Database, actor: ScenarioActor, scenarioId: number, input: { scenarioVersion: number; result: unknown }): Promise<RiskResultView | null> {
  const record = await visibleScenario(db, actor, scenarioId);
  if (record.version !== input.scenarioVersion) {
    throw conflict(`The scenario was saved since this run (version ${record.version}, the run used ${input.scenarioVersion}): run it again`, {
      latest: { version: record.version },
    });
  }
  await saveRiskResult(db, {
    scenarioId,
    inputsHash: riskInputsHash(record.document),
    scenarioVersion: record.version,
    result: input.result,
    userId: actor.userId,
    now: new Date(),
  });
  return readRiskResult(db, actor, scenarioId);
}
