/** Scenario rows and their versions as plain objects; JSON columns parsed here (MariaDB returns them as text). */
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/mysql-core';
import type { Scenario } from '../../../shared/schema/index.js';
import { readScenarioDocument } from '../../../shared/schema/stored-scenario.js';
import type { Database } from '../client.js';
import { scenariosTable, scenarioVersionsTable, usersTable, type ScenarioStatus } from '../schema/index.js';

/** What the list shows without reading documents. */
export interface ScenarioSummary {
  optionCount: number;
  best: { optionId: string; name: string; npv: number } | null;
  /** The engine key it was made under (absent on rows saved before it was kept): another key means remake it. */
  engineKey?: string;
}

export interface ScenarioRecord {
  id: number;
  farmId: number;
  name: string;
  status: ScenarioStatus;
  version: number;
  /** Migrated to the current format and validated by readScenarioDocument. */
  document: Scenario;
  summary: ScenarioSummary;
  createdBy: { id: number; name: string } | null;
  updatedBy: { id: number; name: string } | null;
  createdAt: Date;
  updatedAt: Date;
}

export interface VersionRecord {
  version: number;
  document: Scenario;
  note: string;
  author: { id: number; name: string } | null;
  createdAt: Date;
}

/** A transaction or the database: repository functions run in either. */
export type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

function parseJson(value: unknown): unknown {
  return typeof value === 'string' ? JSON.parse(value) : value;
}

function person(id: number | null, name: string | null): { id: number; name: string } | null {
  return id !== null && name !== null ? { id, name } : null;
}

const creator = alias(usersTable, 'creator');
const updater = alias(usersTable, 'updater');

function selectScenarios(db: Executor) {
  return db
    .select({
      row: scenariosTable,
      creatorName: creator.name,
      updaterName: updater.name,
    })
    .from(scenariosTable)
    .leftJoin(creator, eq(creator.id, scenariosTable.createdBy))
    .leftJoin(updater, eq(updater.id, scenariosTable.updatedBy));
}

type ScenarioSelectRow = Awaited<ReturnType<ReturnType<typeof selectScenarios>['execute']>>[number];

function toRecord({ row, creatorName, updaterName }: ScenarioSelectRow): ScenarioRecord {
  return {
    id: row.id,
    farmId: row.farmId,
    name: row.name,
    status: row.status,
    version: row.version,
    document: readScenarioDocument(parseJson(row.document)),
    summary: parseJson(row.summary) as ScenarioSummary,
    createdBy: person(row.createdBy, creatorName),
    updatedBy: person(row.updatedBy, updaterName),
    createdAt: row.createdAt,
    updatedAt: row.updatedAt,
  };
}

/** Scenarios of a farm, most recently saved first. */
export async function listScenarios(db: Executor, farmId: number): Promise<ScenarioRecord[]> {
  const rows = await selectScenarios(db).where(eq(scenariosTable.farmId, farmId)).orderBy(desc(scenariosTable.updatedAt), asc(scenariosTable.id));
  return rows.map(toRecord);
}

/** One scenario of this farm; null for an id of another farm, so ids reveal nothing. */
export async function findScenario(db: Executor, farmId: number, scenarioId: number): Promise<ScenarioRecord | null> {
  const [row] = await selectScenarios(db).where(and(eq(scenariosTable.farmId, farmId), eq(scenariosTable.id, scenarioId)));
  return row ? toRecord(row) : null;
}

/** Rewrites the list summary of a scenario still at this version (a save since then wrote its own). */
export async function updateScenarioSummary(db: Executor, scenarioId: number, version: number, summary: ScenarioSummary): Promise<void> {
  await db
    .update(scenariosTable)
    .set({ summary })
    .where(and(eq(scenariosTable.id, scenarioId), eq(scenariosTable.version, version)));
}

/** A scenario record without its document and summary: what a read needs when the results are kept. */
export type ScenarioHead = Omit<ScenarioRecord, 'document' | 'summary'>;

/** The columns of a scenario head, with its creator's and last saver's names (join `creator` and `updater`). */
export const scenarioHeadColumns = {
  id: scenariosTable.id,
  farmId: scenariosTable.farmId,
  name: scenariosTable.name,
  status: scenariosTable.status,
  version: scenariosTable.version,
  createdById: scenariosTable.createdBy,
  updatedById: scenariosTable.updatedBy,
  createdAt: scenariosTable.createdAt,
  updatedAt: scenariosTable.updatedAt,
  creatorName: creator.name,
  updaterName: updater.name,
};

/** The aliases `scenarioHeadColumns` reads the names from. */
export { creator as scenarioCreator, updater as scenarioUpdater };

export type ScenarioHeadRow = Omit<ScenarioHead, 'createdBy' | 'updatedBy'> & {
  createdById: number | null;
  updatedById: number | null;
  creatorName: string | null;
  updaterName: string | null;
};

/** A row of `scenarioHeadColumns` as a head. */
export function toScenarioHead({ createdById, updatedById, creatorName, updaterName, ...row }: ScenarioHeadRow): ScenarioHead {
  return { ...row, createdBy: person(createdById, creatorName), updatedBy: person(updatedById, updaterName) };
}

function prepareScenarioHead(db: Executor) {
  return db
    .select(scenarioHeadColumns)
    .from(scenariosTable)
    .leftJoin(creator, eq(creator.id, scenariosTable.createdBy))
    .leftJoin(updater, eq(updater.id, scenariosTable.updatedBy))
    .where(and(eq(scenariosTable.farmId, sql.placeholder('farmId')), eq(scenariosTable.id, sql.placeholder('scenarioId'))))
    .prepare();
}

/** Built once per pool (or transaction): every read of a scenario asks this, so its SQL is not rebuilt each time. */
const preparedHeads = new WeakMap<Executor, ReturnType<typeof prepareScenarioHead>>();

/** One scenario of this farm without reading its document; null for an id of another farm. */
export async function findScenarioHead(db: Executor, farmId: number, scenarioId: number): Promise<ScenarioHead | null> {
  let prepared = preparedHeads.get(db);
  if (!prepared) {
    prepared = prepareScenarioHead(db);
    preparedHeads.set(db, prepared);
  }
  const [found] = await prepared.execute({ farmId, scenarioId });
  return found ? toScenarioHead(found) : null;
}

/** One version without its document; null when there is none. */
export async function findVersionHead(db: Executor, scenarioId: number, version: number): Promise<Omit<VersionRecord, 'document'> | null> {
  const [row] = await db
    .select({
      version: scenarioVersionsTable.version,
      note: scenarioVersionsTable.note,
      createdAt: scenarioVersionsTable.createdAt,
      authorId: scenarioVersionsTable.authorId,
      authorName: usersTable.name,
    })
    .from(scenarioVersionsTable)
    .leftJoin(usersTable, eq(usersTable.id, scenarioVersionsTable.authorId))
    .where(and(eq(scenarioVersionsTable.scenarioId, scenarioId), eq(scenarioVersionsTable.version, version)));
  return row ? { version: row.version, note: row.note, createdAt: row.createdAt, author: person(row.authorId, row.authorName) } : null;
}

/** Locks the scenario row until the transaction ends (SELECT … FOR UPDATE) and returns its version, or null. */
export async function lockScenario(tx: Executor, farmId: number, scenarioId: number): Promise<{ version: number } | null> {
  const [row] = await tx
    .select({ version: scenariosTable.version })
    .from(scenariosTable)
    .where(and(eq(scenariosTable.farmId, farmId), eq(scenariosTable.id, scenarioId)))
    .for('update');
  return row ?? null;
}

export interface NewScenario {
  farmId: number;
  name: string;
  /** The validated document as JSON text: written once, to the scenario row (see copyHeadToVersion). */
  documentText: string;
  summary: ScenarioSummary;
  userId: number;
  note: string;
  now: Date;
}

/** Inserts a scenario at version 1 and its first version row; call inside a transaction. Returns the new id. */
export async function insertScenario(tx: Executor, input: NewScenario): Promise<number> {
  const [result] = await tx.insert(scenariosTable).values({
    farmId: input.farmId,
    name: input.name,
    version: 1,
    document: sql`${input.documentText}`,
    summary: input.summary,
    createdBy: input.userId,
    updatedBy: input.userId,
    createdAt: input.now,
    updatedAt: input.now,
  });
  await copyHeadToVersion(tx, result.insertId, input.note);
  return result.insertId;
}

export interface SavedVersion {
  scenarioId: number;
  version: number;
  name: string;
  /** The validated document as JSON text. */
  documentText: string;
  summary: ScenarioSummary;
  userId: number;
  note: string;
  now: Date;
}

/** Writes the scenario's new state and its immutable version row; call inside a transaction after lockScenario. */
export async function updateScenarioVersion(tx: Executor, input: SavedVersion): Promise<void> {
  await tx
    .update(scenariosTable)
    .set({
      name: input.name,
      version: input.version,
      document: sql`${input.documentText}`,
      summary: input.summary,
      updatedBy: input.userId,
      updatedAt: input.now,
    })
    .where(eq(scenariosTable.id, input.scenarioId));
  await copyHeadToVersion(tx, input.scenarioId, input.note);
}

/**
 * The version row of the scenario row as just written (its version, document, author and time),
 * copied inside the database: a document of ~100 KB then crosses the wire and is escaped once
 * per save, not once per copy.
 */
async function copyHeadToVersion(tx: Executor, scenarioId: number, note: string): Promise<void> {
  await tx.insert(scenarioVersionsTable).select(
    tx
      .select({
        id: sql`null`.as('id'),
        scenarioId: scenariosTable.id,
        version: scenariosTable.version,
        document: scenariosTable.document,
        authorId: scenariosTable.updatedBy,
        note: sql`${note}`.as('note'),
        createdAt: scenariosTable.updatedAt,
      })
      .from(scenariosTable)
      .where(eq(scenariosTable.id, scenarioId)),
  );
}

export async function setScenarioStatus(db: Executor, farmId: number, scenarioId: number, status: ScenarioStatus): Promise<void> {
  await db
    .update(scenariosTable)
    .set({ status })
    .where(and(eq(scenariosTable.farmId, farmId), eq(scenariosTable.id, scenarioId)));
}

/** Deletes the scenario and (by cascade) its versions. */
export async function deleteScenario(db: Executor, farmId: number, scenarioId: number): Promise<void> {
  await db.delete(scenariosTable).where(and(eq(scenariosTable.farmId, farmId), eq(scenariosTable.id, scenarioId)));
}

/** The scenario's versions without their documents, newest first. */
export async function listVersions(db: Executor, scenarioId: number): Promise<Omit<VersionRecord, 'document'>[]> {
  const rows = await db
    .select({
      version: scenarioVersionsTable.version,
      note: scenarioVersionsTable.note,
      createdAt: scenarioVersionsTable.createdAt,
      authorId: scenarioVersionsTable.authorId,
      authorName: usersTable.name,
    })
    .from(scenarioVersionsTable)
    .leftJoin(usersTable, eq(usersTable.id, scenarioVersionsTable.authorId))
    .where(eq(scenarioVersionsTable.scenarioId, scenarioId))
    .orderBy(desc(scenarioVersionsTable.version));
  return rows.map((r) => ({ version: r.version, note: r.note, createdAt: r.createdAt, author: person(r.authorId, r.authorName) }));
}

export async function findVersion(db: Executor, scenarioId: number, version: number): Promise<VersionRecord | null> {
  const [row] = await db
    .select({
      version: scenarioVersionsTable.version,
      document: scenarioVersionsTable.document,
      note: scenarioVersionsTable.note,
      createdAt: scenarioVersionsTable.createdAt,
      authorId: scenarioVersionsTable.authorId,
      authorName: usersTable.name,
    })
    .from(scenarioVersionsTable)
    .leftJoin(usersTable, eq(usersTable.id, scenarioVersionsTable.authorId))
    .where(and(eq(scenarioVersionsTable.scenarioId, scenarioId), eq(scenarioVersionsTable.version, version)));
  if (!row) return null;
  return { version: row.version, document: readScenarioDocument(parseJson(row.document)), note: row.note, createdAt: row.createdAt, author: person(row.authorId, row.authorName) };
}
