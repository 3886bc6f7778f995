/** Users, farms and who belongs to which farm with which role. */
import {
  boolean,
  index,
  json,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { createdAt, id, ref } from './columns.js';


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

export type UserRow = typeof usersTable.$inferSelect;
export type FarmRow = typeof farmsTable.$inferSelect;
export type MembershipRow = typeof membershipsTable.$inferSelect;
