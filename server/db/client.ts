import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema/index.js';

export type Database = MySql2Database<typeof schema>;

export interface DatabaseHandle {
  db: Database;
  pool: mysql.Pool;
  close(): Promise<void>;
}

/** Opens a connection pool; `mode: 'planetscale'` because MariaDB lacks LATERAL joins. */
export function openDatabase(url: string, connectionLimit = 10): DatabaseHandle {
  // A stopped database must answer in seconds (503), not hang a request: short connect timeout.
  const pool = mysql.createPool({ uri: url, connectionLimit, timezone: 'Z', dateStrings: false, connectTimeout: 2_000 });
  const db = drizzle({ client: pool, schema, mode: 'planetscale' });
  return { db, pool, close: () => pool.end() };
}

/** True when the server answers a trivial query. */
export async function databaseIsUp(pool: mysql.Pool): Promise<boolean> {
  try {
    await pool.query('SELECT 1');
    return true;
  } catch {
    return false;
  }
}
