/** Uploaded documents (quotes, drawings, photos) and the record of milk-record imports. */
import { char, date, decimal, index, int, json, mysqlEnum, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { farmsTable, usersTable } from './accounts.js';
import { createdAt, id, ref, timestamp } from './columns.js';
import { scenariosTable } from './scenarios.js';

export const documentsTable = mysqlTable(
  'documents',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    /**
     * The scenario and capital line the document backs, when it is attached to one. Capital
     * lines live inside the scenario's JSON document, so only the scenario has a foreign key;
     * deleting a scenario keeps its documents on the farm (their files are still the farm's).
     */
    scenarioId: ref('scenario_id').references(() => scenariosTable.id, { onDelete: 'set null' }),
    capitalLineId: varchar('capital_line_id', { length: 60 }),
    /** The uploader's file name, sanitised; only ever shown and sent back in Content-Disposition. */
    fileName: varchar('file_name', { length: 255 }).notNull(),
    /** Sniffed from the bytes, never taken from the upload's header. */
    mediaType: varchar('media_type', { length: 100 }).notNull(),
    sizeBytes: int('size_bytes', { unsigned: true }).notNull(),
    sha256: char('sha256', { length: 64 }).notNull(),
    storageKey: varchar('storage_key', { length: 64 }).notNull(),
    /** A contractor quote's amount in the farm's currency, for a document on a capital line. */
    quoteAmount: decimal('quote_amount', { precision: 14, scale: 2 }),
    uploadedBy: ref('uploaded_by').references(() => usersTable.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('documents_farm_scenario_idx').on(t.farmId, t.scenarioId), uniqueIndex('documents_storage_key_unique').on(t.storageKey)],
);

export const milkImportStatuses = ['preview', 'confirmed'] as const;

export const milkRecordImportsTable = mysqlTable(
  'milk_record_imports',
  {
    id: id(),
    farmId: ref('farm_id')
      .notNull()
      .references(() => farmsTable.id, { onDelete: 'cascade' }),
    status: mysqlEnum('status', milkImportStatuses).notNull(),
    /** Confirms a preview; cleared once confirmed so it works once. */
    token: char('token', { length: 32 }),
    fileName: varchar('file_name', { length: 255 }).notNull(),
    rowsRead: int('rows_read', { unsigned: true }).notNull(),
    rowsAccepted: int('rows_accepted', { unsigned: true }).notNull(),
    rowsRefused: int('rows_refused', { unsigned: true }).notNull(),
    firstDate: date('first_date', { mode: 'string' }),
    lastDate: date('last_date', { mode: 'string' }),
    herdSize: int('herd_size', { unsigned: true }).notNull(),
    averageYieldKgPerCowDay: decimal('average_yield_kg_per_cow_day', { precision: 6, scale: 2 }),
    /** The preview's full summary (refused rows listed up to the reader's cap). */
    summary: json('summary').notNull(),
    previousHerdSize: int('previous_herd_size', { unsigned: true }),
    previousYieldKgPerCowDay: decimal('previous_yield_kg_per_cow_day', { precision: 6, scale: 2 }),
    createdBy: ref('created_by').references(() => usersTable.id, { onDelete: 'set null' }),
    confirmedBy: ref('confirmed_by').references(() => usersTable.id, { onDelete: 'set null' }),
    confirmedAt: timestamp('confirmed_at'),
    expiresAt: timestamp('expires_at'),
    createdAt: createdAt(),
  },
  (t) => [index('milk_record_imports_farm_idx').on(t.farmId, t.status), uniqueIndex('milk_record_imports_token_unique').on(t.token)],
);

export type DocumentRow = typeof documentsTable.$inferSelect;
export type MilkRecordImportRow = typeof milkRecordImportsTable.$inferSelect;
