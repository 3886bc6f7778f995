/**
 * The scenario rules: who may see which scenario, creating (from the farm baseline or an
 * imported document), saving with optimistic locking, versions and their comparison. Option
 * operations are edits of the document (`shared/option-operations.ts`) saved whole. Every
 * save takes a whole validated document and writes a new immutable version in the same
 * transaction as the scenario row, locked with SELECT … FOR UPDATE.
 */
import type { JsonText, ResultsDetailView, ScenarioListItem, ScenarioMeta, ScenarioView, VersionComparison, VersionListItem, VersionView } from '../../shared/responses.js';
import type { z } from 'zod';
import { evaluateScenario, type ScenarioResultsSummary, type ScenarioResults, resultsCacheKey } from '../../shared/engine/index.js';
import { candidatesByChange } from '../../shared/candidates.js';
import { diffScenarios, type Json } from '../../shared/scenario-diff.js';
import type { createScenarioBodySchema } from '../../shared/schema/requests.js';
import { DEFAULT_FINANCE, herdSchema, scenarioSchema, type Scenario, type ScenarioInput } from '../../shared/schema/index.js';
import { createOption } from '../../shared/starting-points.js';
import type { UnitSystem } from '../../shared/units.js';
import type { Database } from '../db/client.js';
import { findFarmBaseline } from '../db/repositories/farm-baseline.js';
import {
  deleteScenario as deleteScenarioRow,
  findScenario,
  findScenarioHead,
  findVersion,
  findVersionHead,
  insertScenario,
  listScenarios,
  listVersions,
  lockScenario,
  setScenarioStatus,
  updateScenarioSummary,
  updateScenarioVersion,
  type Executor,
  type ScenarioHead,
  type ScenarioRecord,
  type ScenarioSummary,
  type VersionRecord,
} from '../db/repositories/scenarios.js';
import type { ScenarioStatus } from '../db/schema/index.js';
import type { KeptResults } from '../db/repositories/scenario-results.js';
import { AppError, fieldErrors, notFound } from '../errors.js';
import { accessOf, canSeeScenario, canSeeVersion, visibleVersions, type Access, type Actor } from './access.js';
import { evaluateForKeeping, keepSaved, keptDetail, keptResults, rememberCommitted } from './scenario-results.js';

export type { ResultsDetailView, ScenarioListItem, ScenarioView, VersionListItem };

/** Who is asking, on which farm. */
export type ScenarioActor = Actor;

/** The record as the caller sees it: for a lender the highest version shared with them, never the latest save. */
async function asSeenBy(db: Executor, access: Access, record: ScenarioRecord): Promise<ScenarioRecord> {
  const versions = visibleVersions(access, record.id);
  if (versions === null) return record;
  const version = versions[0];
  const found = version === undefined ? null : await findVersion(db, record.id, version);
  if (!found) throw notFound('Scenario not found');
  const document = found.document;
  return { ...record, name: document.name, version: found.version, document, updatedAt: found.createdAt, updatedBy: found.author };
}

/** 404 unless the caller may read this version. */
function assertVersionVisible(access: Access, scenarioId: number, version: number): void {
  if (!canSeeVersion(access, scenarioId, version)) throw notFound(`Version ${version} not found`);
}

/**
 * Option count and the best candidate by the NPV of its change against the current option
 * (currency), for the list. The current option is the reference, not a candidate: when no
 * candidate pays, the best is still the least bad change, with its negative figure. Never by an
 * option's own whole-herd flows, which rank barns by the herd's margin rather than by what building changes.
 */
export function summarise(results: { options: readonly { id: string; name: string; incremental: { npv: number } | null }[] }): ScenarioSummary {
  const first = candidatesByChange(results.options)[0];
  const best = first ? { optionId: first.id, name: first.name, npv: first.incremental.npv } : null;
  // Stamped with the engine key: when the engine or this rule changes (ENGINE_VERSION is raised
  // with either), the list remakes the summary instead of showing the old rule's best.
  return { optionCount: results.options.length, best, engineKey: resultsCacheKey() };
}

/** The answer of GET S written around the kept texts, which are sent as they are. */
function viewText(head: ScenarioHead, kept: Pick<KeptResults, 'name' | 'document' | 'summary'>): JsonText<ScenarioView> {
  const meta: ScenarioMeta = {
    id: head.id,
    farmId: head.farmId,
    name: kept.name,
    status: head.status,
    version: head.version,
    createdAt: head.createdAt.toISOString(),
    createdBy: head.createdBy?.name ?? null,
    updatedAt: head.updatedAt.toISOString(),
    updatedBy: head.updatedBy?.name ?? null,
  };
  const metaJson = JSON.stringify(meta);
  return {
    key: `scenario:${head.id}:${head.version}:${resultsCacheKey()}:${metaJson}`,
    text: `{"id":${head.id},"scenario":${kept.document},"version":${head.version},"results":${kept.summary},"meta":${metaJson}}`,
  };
}

/** Validates a document the server built or changed; errors name fields under `scenario.`. */
function validated(document: unknown): Scenario {
  const result = scenarioSchema.safeParse(document);
  if (result.success) return result.data;
  const fields = Object.fromEntries(Object.entries(fieldErrors(result.error)).map(([path, message]) => [`scenario.${path}`, message]));
  const first = Object.entries(fields)[0];
  throw new AppError(400, 'invalid_input', first ? `${first[0]}: ${first[1]}` : 'Invalid scenario', fields);
}

/** The scenario as the caller may see it (a lender: the shared version); 404 otherwise. */
export async function visibleRecord(db: Executor, actor: ScenarioActor, scenarioId: number): Promise<ScenarioRecord> {
  const access = await accessOf(db, actor);
  const record = canSeeScenario(access, scenarioId) ? await findScenario(db, actor.farmId, scenarioId) : null;
  if (!record) throw notFound('Scenario not found');
  return asSeenBy(db, access, record);
}

/** A scenario's head already read in this request (with the session): `head` null when the farm has no such scenario. */
export interface KnownHead {
  head: ScenarioHead | null;
}

/**
 * Like visibleRecord without reading the document: for a lender the shared version's number, time
 * and author. `known` is the scenario's head read earlier in the request, instead of reading it again.
 */
async function visibleHead(db: Executor, actor: ScenarioActor, scenarioId: number, access?: Access, known?: KnownHead): Promise<ScenarioHead> {
  const seen = access ?? (await accessOf(db, actor));
  const head = canSeeScenario(seen, scenarioId) ? (known ? known.head : await findScenarioHead(db, actor.farmId, scenarioId)) : null;
  if (!head) throw notFound('Scenario not found');
  const versions = visibleVersions(seen, scenarioId);
  if (versions === null) return head;
  const version = versions[0];
  const found = version === undefined ? null : await findVersionHead(db, scenarioId, version);
  if (!found) throw notFound('Scenario not found');
  return { ...head, version: found.version, updatedAt: found.createdAt, updatedBy: found.author };
}

/** The record with a summary made under today's engine key: one made under another is remade from the kept results and written back. */
async function withCurrentSummary(db: Database, record: ScenarioRecord): Promise<ScenarioRecord> {
  if (record.summary.engineKey === resultsCacheKey()) return record;
  const summary = summarise(JSON.parse((await keptResults(db, record.id, record.version)).summary) as ScenarioResultsSummary);
  await updateScenarioSummary(db, record.id, record.version, summary);
  return { ...record, summary };
}

/** The farm's scenarios the caller may see, most recently saved first. */
export async function listFarmScenarios(db: Database, actor: ScenarioActor): Promise<ScenarioListItem[]> {
  const access = await accessOf(db, actor);
  const visible = (await listScenarios(db, actor.farmId)).filter((record) => canSeeScenario(access, record.id));
  // A lender's list describes the shared version, so its summary comes from that version's kept results.
  const records = access.grants
    ? await Promise.all(
        visible.map(async (record) => {
          const seen = await visibleHead(db, actor, record.id, access);
          const kept = await keptResults(db, record.id, seen.version);
          return { ...seen, name: kept.name, summary: summarise(JSON.parse(kept.summary) as ScenarioResultsSummary) };
        }),
      )
    : await Promise.all(visible.map((record) => withCurrentSummary(db, record)));
  return records
    .map((record) => ({
      id: record.id,
      name: record.name,
      status: record.status,
      version: record.version,
      optionCount: record.summary.optionCount,
      best: record.summary.best,
      updatedAt: record.updatedAt.toISOString(),
      updatedBy: record.updatedBy?.name ?? null,
    }));
}

/** The version of a scenario the caller sees, with the summary of its results, as JSON text: nothing is parsed or evaluated once its results are kept. */
export async function readScenario(db: Executor, actor: ScenarioActor, scenarioId: number, known?: KnownHead): Promise<JsonText<ScenarioView>> {
  const head = await visibleHead(db, actor, scenarioId, undefined, known);
  return viewText(head, await keptResults(db, scenarioId, head.version));
}

/** The version the caller sees (or `version`, when they may see it): each option's yearly lines and loan payments. */
export async function readResultsDetail(db: Database, actor: ScenarioActor, scenarioId: number, version?: number, known?: KnownHead): Promise<JsonText<ResultsDetailView>> {
  const access = await accessOf(db, actor);
  const head = await visibleHead(db, actor, scenarioId, access, known);
  const at = version ?? head.version;
  assertVersionVisible(access, scenarioId, at);
  if (at > head.version) throw notFound(`Version ${at} not found`);
  return { key: `detail:${scenarioId}:${at}:${resultsCacheKey()}`, text: `{"version":${at},"options":${await keptDetail(db, scenarioId, at)}}` };
}

/** The version the caller sees with its whole results (yearly lines and loan payments too), for the lender workbook. */
export async function readScenarioWhole(db: Database, actor: ScenarioActor, scenarioId: number): Promise<{ scenario: Scenario; results: ScenarioResults; version: number; updatedBy: string | null }> {
  const record = await visibleRecord(db, actor, scenarioId);
  return { scenario: record.document, results: evaluateScenario(record.document), version: record.version, updatedBy: record.updatedBy?.name ?? null };
}

async function createScenario(db: Database, actor: ScenarioActor, document: Scenario, note: string): Promise<JsonText<ScenarioView>> {
  const results = evaluateForKeeping(document);
  const documentText = JSON.stringify(document);
  const { id, kept } = await db.transaction(async (tx) => {
    const created = await insertScenario(tx, {
      farmId: actor.farmId,
      name: document.name,
      documentText,
      summary: summarise(results),
      userId: actor.userId,
      note,
      now: new Date(),
    });
    return { id: created, kept: await keepSaved(tx, created, document, documentText, results) };
  });
  rememberCommitted(db, id, 1, kept);
  return readScenario(db, actor, id);
}

/** A new scenario from the farm baseline: herd, currency and units copied, one current option from a starting point. */
export async function createFromBaseline(
  db: Database,
  actor: ScenarioActor,
  input: z.output<typeof createScenarioBodySchema>,
): Promise<JsonText<ScenarioView>> {
  const farm = await findFarmBaseline(db, actor.farmId);
  const herd = herdSchema.safeParse(farm?.herd);
  if (!farm || !herd.success) {
    throw new AppError(409, 'baseline_missing', 'Set the farm baseline (herd and markets) before creating a scenario from it');
  }
  const current = createOption(input.startingPoint, herd.data, {
    id: input.startingPoint,
    current: true,
    ...(input.currentOptionName ? { name: input.currentOptionName } : {}),
  });
  const document = validated({
    schemaVersion: 1,
    name: input.name,
    currency: farm.currency,
    locale: farm.locale,
    units: farm.units,
    herd: herd.data,
    options: [current],
    finance: DEFAULT_FINANCE,
  } satisfies ScenarioInput);
  return createScenario(db, actor, document, 'Created from the farm baseline');
}

/** A new scenario from a whole (already validated) document: an import, or a copy kept after a conflict. */
export async function importScenario(db: Database, actor: ScenarioActor, scenario: Scenario, name?: string): Promise<JsonText<ScenarioView>> {
  return createScenario(db, actor, name ? { ...scenario, name } : scenario, 'Imported');
}

/**
 * Saves `document` (validated by the route or read from a kept version) as the next version, in one
 * transaction with the row locked; the new version's results are evaluated once and kept with it.
 * With `basedOn`, a scenario saved since then gives 409 `version_conflict` with who saved the
 * newer version and when; nothing is written.
 */
async function saveChange(
  db: Database,
  actor: ScenarioActor,
  scenarioId: number,
  basedOn: number | undefined,
  note: string,
  document: Scenario,
): Promise<JsonText<ScenarioView>> {
  const saved = await db.transaction(async (tx) => {
    const access = await accessOf(tx, actor);
    const locked = canSeeScenario(access, scenarioId) ? await lockScenario(tx, actor.farmId, scenarioId) : null;
    if (!locked) throw notFound('Scenario not found');
    if (basedOn !== undefined && basedOn !== locked.version) {
      const latest = await visibleHead(tx, actor, scenarioId, access);
      throw new AppError(
        409,
        'version_conflict',
        `${latest.updatedBy?.name ?? 'Someone'} saved version ${latest.version} of this scenario after version ${basedOn}, which your changes are based on`,
        undefined,
        { latest: { version: latest.version, updatedBy: latest.updatedBy?.name ?? null, updatedAt: latest.updatedAt.toISOString() } },
      );
    }
    const results = evaluateForKeeping(document);
    const version = locked.version + 1;
    const documentText = JSON.stringify(document);
    await updateScenarioVersion(tx, {
      scenarioId,
      version,
      name: document.name,
      documentText,
      summary: summarise(results),
      userId: actor.userId,
      note,
      now: new Date(),
    });
    return { version, kept: await keepSaved(tx, scenarioId, document, documentText, results) };
  });
  rememberCommitted(db, scenarioId, saved.version, saved.kept);
  return readScenario(db, actor, scenarioId);
}

/** Saves a whole document (PUT) based on `version`. */
export function saveScenario(db: Database, actor: ScenarioActor, scenarioId: number, version: number, scenario: Scenario, note?: string): Promise<JsonText<ScenarioView>> {
  return saveChange(db, actor, scenarioId, version, note ?? '', scenario);
}

/** A new scenario holding a copy of the latest document. */
export async function duplicateScenario(db: Database, actor: ScenarioActor, scenarioId: number, name?: string): Promise<JsonText<ScenarioView>> {
  const record = await visibleRecord(db, actor, scenarioId);
  const document = validated({ ...(record.document), name: name ?? `${record.name} (copy)` });
  return createScenario(db, actor, document, `Copied from "${record.name}" version ${record.version}`);
}

/** Sets the status to archived; the document and its versions stay. */
export async function archiveScenario(db: Database, actor: ScenarioActor, scenarioId: number): Promise<{ id: number; status: ScenarioStatus }> {
  await visibleHead(db, actor, scenarioId);
  await setScenarioStatus(db, actor.farmId, scenarioId, 'archived');
  return { id: scenarioId, status: 'archived' };
}

/** Deletes the scenario with all its versions. */
export async function deleteScenario(db: Database, actor: ScenarioActor, scenarioId: number): Promise<void> {
  await visibleHead(db, actor, scenarioId);
  await deleteScenarioRow(db, actor.farmId, scenarioId);
}

export async function scenarioVersions(db: Database, actor: ScenarioActor, scenarioId: number): Promise<VersionListItem[]> {
  const access = await accessOf(db, actor);
  await visibleHead(db, actor, scenarioId, access);
  const versions = (await listVersions(db, scenarioId)).filter((v) => canSeeVersion(access, scenarioId, v.version));
  return versions.map((v) => ({ version: v.version, note: v.note, author: v.author?.name ?? null, createdAt: v.createdAt.toISOString() }));
}

async function versionOf(db: Database, scenarioId: number, version: number): Promise<VersionRecord> {
  const found = await findVersion(db, scenarioId, version);
  if (!found) throw notFound(`Version ${version} not found`);
  return found;
}

/** One past version, read-only, with the summary of its results (kept, so evaluated at most once), as JSON text. */
export async function readVersion(db: Database, actor: ScenarioActor, scenarioId: number, version: number): Promise<JsonText<VersionView>> {
  const access = await accessOf(db, actor);
  await visibleHead(db, actor, scenarioId, access);
  assertVersionVisible(access, scenarioId, version);
  const found = await findVersionHead(db, scenarioId, version);
  if (!found) throw notFound(`Version ${version} not found`);
  const kept = await keptResults(db, scenarioId, version);
  const about = JSON.stringify({ version: found.version, note: found.note, author: found.author?.name ?? null, createdAt: found.createdAt.toISOString() });
  return { key: `version:${scenarioId}:${resultsCacheKey()}:${about}`, text: `${about.slice(0, -1)},"scenario":${kept.document},"results":${kept.summary}}` };
}

/** Changed fields between two versions, in `units` for display (the farm's units by default). */
export async function compareVersions(
  db: Database,
  actor: ScenarioActor,
  scenarioId: number,
  from: number,
  to: number,
  units?: UnitSystem,
): Promise<VersionComparison> {
  const access = await accessOf(db, actor);
  await visibleHead(db, actor, scenarioId, access);
  assertVersionVisible(access, scenarioId, from);
  assertVersionVisible(access, scenarioId, to);
  const [older, newer] = await Promise.all([versionOf(db, scenarioId, from), versionOf(db, scenarioId, to)]);
  const shownIn = units ?? (await findFarmBaseline(db, actor.farmId))?.units ?? 'metric';
  return { from, to, units: shownIn, changes: diffScenarios(older.document as Json, newer.document as Json, shownIn) };
}

/** Saves a past version's document as the next version. */
export async function restoreVersion(
  db: Database,
  actor: ScenarioActor,
  scenarioId: number,
  version: number,
  basedOn?: number,
  note?: string,
): Promise<JsonText<ScenarioView>> {
  await visibleHead(db, actor, scenarioId);
  const past = await versionOf(db, scenarioId, version);
  // The past document was validated as it was read: it is saved whole, as a PUT is.
  return saveChange(db, actor, scenarioId, basedOn, note ?? `Restored version ${version}`, past.document);
}

/** The latest document as the file `npm run evaluate` reads, and a file name for it. */
export async function exportScenario(db: Database, actor: ScenarioActor, scenarioId: number): Promise<{ fileName: string; document: Scenario }> {
  const record = await visibleRecord(db, actor, scenarioId);
  const slug = record.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'scenario';
  return { fileName: `${slug}-v${record.version}.json`, document: record.document };
}
