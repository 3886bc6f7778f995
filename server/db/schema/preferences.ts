/**
 * What the people on a farm think of a scenario's options: each member's preference (one per
 * person per scenario, replaced when they change their mind), the owner's decisions (only ever
 * inserted, the latest is the decision), and the last Monte Carlo result kept with the hash of
 * the inputs it was computed from, so a stale result is never shown as current.
 */
import { sql } from 'drizzle-orm';
import { datetime, index, int, json, mysqlTable, primaryKey, varchar } from 'drizzle-orm/mysql-core';
import { usersTable } from './accounts.js';
import { id, ref, timestamp } from './columns.js';
import { scenariosTable } from './scenarios.js';

export const scenarioPreferencesTable = mysqlTable(
  'scenario_preferences',
  {
    scenarioId: ref('scenario_id')
      .notNull()
      .references(() => scenariosTable.id, { onDelete: 'cascade' }),
    userId: ref('user_id')
      .notNull()
      .references(() => usersTable.id, { onDelete: 'cascade' }),
    /** Option id inside the scenario document. */
    optionId: varchar('option_id', { length: 60 }).notNull(),
    reason: varchar('reason', { length: 500 }).notNull().default(''),
    updatedAt: timestamp('updated_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.scenarioId, t.userId] })],
);

export const scenarioDecisionsTable = mysqlTable(
  'scenario_decisions',
  {
    id: id(),
    scenarioId: ref('scenario_id')
      .notNull()
      .references(() => scenariosTable.id, { onDelete: 'cascade' }),
    optionId: varchar('option_id', { length: 60 }).notNull(),
    /** The option's name when decided, so the record still reads if the option is renamed or removed. */
    optionName: varchar('option_name', { length: 120 }).notNull(),
    decidedBy: ref('decided_by').references(() => usersTable.id, { onDelete: 'set null' }),
    decidedAt: datetime('decided_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`),
    note: varchar('note', { length: 500 }).notNull().default(''),
    /** Scenario version the decision was made on. */
    scenarioVersion: int('scenario_version', { unsigned: true }).notNull(),
  },
  (t) => [index('scenario_decisions_scenario_idx').on(t.scenarioId)],
);

export const riskResultsTable = mysqlTable('risk_results', {
  scenarioId: ref('scenario_id')
    .primaryKey()
    .references(() => scenariosTable.id, { onDelete: 'cascade' }),
  /** SHA-256 (hex) of the canonical JSON of everything the Monte Carlo result depends on. */
  inputsHash: varchar('inputs_hash', { length: 64 }).notNull(),
  scenarioVersion: int('scenario_version', { unsigned: true }).notNull(),
  result: json('result').notNull(),
  savedBy: ref('saved_by').references(() => usersTable.id, { onDelete: 'set null' }),
  savedAt: timestamp('saved_at').notNull(),
});

export type ScenarioPreferenceRow = typeof scenarioPreferencesTable.$inferSelect;
export type ScenarioDecisionRow = typeof scenarioDecisionsTable.$inferSelect;
export type RiskResultRow = typeof riskResultsTable.$inferSelect;
