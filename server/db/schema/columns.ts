/**
 * Column helpers shared by every table. Ids are unsigned INT auto-increment because drizzle's
 * serial() is not valid on MariaDB; foreign keys must use exactly the same type (`ref`).
 */
import { sql } from 'drizzle-orm';
import { datetime, int } from 'drizzle-orm/mysql-core';

export const id = () => int('id', { unsigned: true }).autoincrement().primaryKey();
export const ref = (name: string) => int(name, { unsigned: true });
export const createdAt = () =>
  datetime('created_at', { mode: 'date', fsp: 3 }).notNull().default(sql`CURRENT_TIMESTAMP(3)`);
export const timestamp = (name: string) => datetime(name, { mode: 'date', fsp: 3 });
