/**
 * Lender shares, review notes and the farm's audit log. A share gives one lender read-only access
 * to one version of one scenario (never "the latest": what the lender reviewed must not change
 * under them); the e-mailed link is a single-use token of which only the sha-256 is stored.
 */
import {
  char,
  date,
  foreignKey,
  index,
  int,
  json,
  mysqlEnum,
  mysqlTable,
  uniqueIndex,
  varchar,
  type AnyMySqlColumn,
} from 'drizzle-orm/mysql-core';
import { farmRoles, farmsTable, usersTable } from './accounts.js';
import { createdAt, id, ref, timestamp } from './columns.js';
import { scenariosTable, scenarioVersionsTable } from './scenarios.js';

export const reviewStatuses = ['open', 'questions', 'supported', 'not-supported'] as const;
export type ReviewStatus = (typeof reviewStatuses)[number];

export const lenderSharesTable = mysqlTable(
  'lender_shares',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    scenarioId: ref('scenario_id').notNull(),
    /** The scenario version shared; later saves of the scenario do not move it. */
    version: int('version', { unsigned: true }).notNull(),
    lenderEmail: varchar('lender_email', { length: 254 }).notNull(),
    /** Set when the link is used: the account that accepted it. */
    lenderUserId: ref('lender_user_id').references(() => usersTable.id, { onDelete: 'set null' }),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    tokenUsedAt: timestamp('token_used_at'),
    /** From this date (UTC) the share no longer opens. */
    expiresOn: date('expires_on', { mode: 'string' }).notNull(),
    revokedAt: timestamp('revoked_at'),
    reviewStatus: mysqlEnum('review_status', reviewStatuses).notNull().default('open'),
    reviewStatusAt: timestamp('review_status_at'),
    reviewStatusBy: ref('review_status_by').references(() => usersTable.id, { onDelete: 'set null' }),
    createdBy: ref('created_by').references(() => usersTable.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [
    uniqueIndex('lender_shares_token_hash_unique').on(t.tokenHash),
    index('lender_shares_farm_idx').on(t.farmId),
    index('lender_shares_lender_idx').on(t.lenderUserId),
    // The shared version must exist; deleting the scenario (and so its versions) removes its shares.
    foreignKey({
      name: 'lender_shares_version_fk',
      columns: [t.scenarioId, t.version],
      foreignColumns: [scenarioVersionsTable.scenarioId, scenarioVersionsTable.version],
    }).onDelete('cascade'),
    foreignKey({ name: 'lender_shares_scenario_fk', columns: [t.scenarioId], foreignColumns: [scenariosTable.id] }).onDelete('cascade'),
  ],
);

/** A lender's note on a share, or a reply in its thread (parent_id: the note answered). */
export const reviewNotesTable = mysqlTable(
  'review_notes',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    scenarioId: ref('scenario_id')
      .notNull()
      .references(() => scenariosTable.id, { onDelete: 'cascade' }),
    shareId: ref('share_id')
      .notNull()
      .references(() => lenderSharesTable.id, { onDelete: 'cascade' }),
    authorId: ref('author_id').references(() => usersTable.id, { onDelete: 'set null' }),
    /** The author's role on the farm when writing, so a thread shows who spoke for the bank. */
    authorRole: mysqlEnum('author_role', farmRoles).notNull(),
    /** Option id inside the shared version's document, when the note is about one option. */
    optionId: varchar('option_id', { length: 60 }),
    /** The line the note is about (a capital or cost line, a projection row), as the lender named it. */
    lineRef: varchar('line_ref', { length: 120 }),
    parentId: ref('parent_id').references((): AnyMySqlColumn => reviewNotesTable.id, { onDelete: 'cascade' }),
    body: varchar('body', { length: 4000 }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('review_notes_share_idx').on(t.shareId)],
);

/** Who did what, when, on a farm: shares, notes, status changes, lender downloads. Rows are only inserted. */
export const auditLogTable = mysqlTable(
  'audit_log',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    actorId: ref('actor_id').references(() => usersTable.id, { onDelete: 'set null' }),
    /** The actor's name at the time, kept when the account goes. */
    actorName: varchar('actor_name', { length: 120 }).notNull(),
    action: varchar('action', { length: 40 }).notNull(),
    /** What it was done to, in words ("Five systems, version 3"). */
    subject: varchar('subject', { length: 240 }).notNull(),
    detail: json('detail').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('audit_log_farm_created_idx').on(t.farmId, t.createdAt)],
);

export type LenderShareRow = typeof lenderSharesTable.$inferSelect;
export type ReviewNoteRow = typeof reviewNotesTable.$inferSelect;
export type AuditLogRow = typeof auditLogTable.$inferSelect;
