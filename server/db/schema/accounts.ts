/** Users, farms and who belongs to which farm with which role. */
import {
  boolean,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  uniqueIndex,
  char,
  varchar,
} from 'drizzle-orm/mysql-core';
import { createdAt, id, ref, timestamp } from './columns.js';


export const farmRoles = ['owner', 'partner', 'consultant', 'lender'] as const;
export type FarmRole = (typeof farmRoles)[number];

export const usersTable = mysqlTable(
  'users',
  {
    id: id(),
    email: varchar('email', { length: 254 }).notNull(),
    name: varchar('name', { length: 120 }).notNull(),
    passwordHash: varchar('password_hash', { length: 100 }).notNull(),
    isAdmin: boolean('is_admin').notNull().default(false),
    /** Raised on sign-out-everywhere and password change: older session tokens stop working. */
    tokenVersion: ref('token_version').notNull().default(0),
    disabled: boolean('disabled').notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('users_email_unique').on(t.email)],
);

export const farmsTable = mysqlTable('farms', {
  id: id(),
  name: varchar('name', { length: 120 }).notNull(),
  location: varchar('location', { length: 160 }).notNull().default(''),
  /** The farm's herd and market baseline (shared/schema herd shape), defaults for new scenarios. */
  baseline: json('baseline'),
  currency: varchar('currency', { length: 3 }).notNull().default('EUR'),
  locale: varchar('locale', { length: 35 }).notNull().default('en-IE'),
  units: mysqlEnum('units', ['metric', 'us']).notNull().default('metric'),
  createdAt: createdAt(),
});

export const membershipsTable = mysqlTable(
  'memberships',
  {
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    userId: ref('user_id')
      .notNull()
      .references(() => usersTable.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', farmRoles).notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.farmId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

/**
 * An e-mailed invitation to join a farm with a role. Only the sha-256 of the token is stored, so
 * a leaked database cannot be turned into working links; accepted or revoked rows are kept as history.
 */
export const invitationsTable = mysqlTable(
  'invitations',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    email: varchar('email', { length: 254 }).notNull(),
    role: mysqlEnum('role', farmRoles).notNull(),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    invitedBy: ref('invited_by').references(() => usersTable.id, { onDelete: 'set null' }),
    expiresAt: timestamp('expires_at').notNull(),
    acceptedAt: timestamp('accepted_at'),
    revokedAt: timestamp('revoked_at'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('invitations_token_hash_unique').on(t.tokenHash), index('invitations_farm_idx').on(t.farmId)],
);

/** A password-reset request: the sha-256 of a single-use token that expires after an hour. */
export const passwordResetsTable = mysqlTable(
  'password_resets',
  {
    id: id(),
    userId: ref('user_id')
      .notNull()
      .references(() => usersTable.id, { onDelete: 'cascade' }),
    tokenHash: char('token_hash', { length: 64 }).notNull(),
    expiresAt: timestamp('expires_at').notNull(),
    usedAt: timestamp('used_at'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('password_resets_token_hash_unique').on(t.tokenHash), index('password_resets_user_idx').on(t.userId)],
);

export type UserRow = typeof usersTable.$inferSelect;
export type FarmRow = typeof farmsTable.$inferSelect;
export type MembershipRow = typeof membershipsTable.$inferSelect;
export type InvitationRow = typeof invitationsTable.$inferSelect;
export type PasswordResetRow = typeof passwordResetsTable.$inferSelect;
