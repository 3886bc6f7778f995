/**
 * Scenarios and their versions. A scenario is one validated JSON document (the engine's
 * `Scenario`: herd, options, capital and running-cost lines, finance, risk) because it is always
 * read, saved and versioned whole; options and lines keep stable string ids inside it, which
 * other tables use together with the scenario id. See DEVELOPERS.md, "Scenarios".
 */
import { index, int, json, longtext, mysqlEnum, mysqlTable, primaryKey, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { farmsTable, usersTable } from './accounts.js';
import { createdAt, id, ref, timestamp } from './columns.js';
import { scenarioStatuses, type ScenarioStatus } from '../../../shared/responses.js';

export { scenarioStatuses, type ScenarioStatus };

export const scenariosTable = mysqlTable(
  'scenarios',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    /** Copy of document.name, for listing without reading documents. */
    name: varchar('name', { length: 120 }).notNull(),
    status: mysqlEnum('status', scenarioStatuses).notNull().default('draft'),
    /** Raised by one on every save; a save based on an older number is refused (optimistic locking). */
    version: int('version', { unsigned: true }).notNull(),
    document: json('document').notNull(),
    /** Option count and best option by NPV, computed at save so the list needs no evaluation. */
    summary: json('summary').notNull(),
    createdBy: ref('created_by').references(() => usersTable.id, { onDelete: 'set null' }),
    updatedBy: ref('updated_by').references(() => usersTable.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: timestamp('updated_at').notNull(),
  },
  (t) => [index('scenarios_farm_idx').on(t.farmId)],
);

/** Every saved state of a scenario; rows are only ever inserted. */
export const scenarioVersionsTable = mysqlTable(
  'scenario_versions',
  {
    id: id(),
    scenarioId: ref('scenario_id')
      .notNull()
      .references(() => scenariosTable.id, { onDelete: 'cascade' }),
    version: int('version', { unsigned: true }).notNull(),
    document: json('document').notNull(),
    authorId: ref('author_id').references(() => usersTable.id, { onDelete: 'set null' }),
    note: varchar('note', { length: 200 }).notNull().default(''),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('scenario_versions_scenario_version_unique').on(t.scenarioId, t.version)],
);

/**
 * Results of one scenario version, kept as JSON text: they are a pure function of the version's
 * document and the engine, so they are computed once (at save, or at the first read of an older
 * version) and a read sends them without parsing or evaluating. `engine_key` is
 * shared/engine/version.ts `resultsCacheKey()`: rows under another key are stale and ignored.
 */
export const scenarioResultsTable = mysqlTable(
  'scenario_results',
  {
    scenarioId: ref('scenario_id')
      .notNull()
      .references(() => scenariosTable.id, { onDelete: 'cascade' }),
    version: int('version', { unsigned: true }).notNull(),
    engineKey: varchar('engine_key', { length: 40 }).notNull(),
    /** The version's document.name, for its meta without reading the document. */
    name: varchar('name', { length: 120 }).notNull(),
    /** The version's document as read today (migrated and validated), as JSON text. */
    document: longtext('document').notNull(),
    /** shared/engine/result-parts.ts ScenarioResultsSummary, as JSON text. */
    summary: longtext('summary').notNull(),
    /** OptionDetail[] (yearly lines and loan payments), as JSON text; null until first read for a version kept at save. */
    detail: longtext('detail'),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ name: 'scenario_results_pk', columns: [t.scenarioId, t.version, t.engineKey] })],
);

export type ScenarioRow = typeof scenariosTable.$inferSelect;
export type ScenarioVersionRow = typeof scenarioVersionsTable.$inferSelect;
