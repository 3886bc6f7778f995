/**
 * One fresh database per test file on the test run's MariaDB (started by tests/run.ts), so
 * files run in parallel without sharing rows. `reset` empties every table between tests.
 */
import { randomBytes } from 'node:crypto';
import mysql from 'mysql2/promise';
import { openDatabase, type DatabaseHandle } from '../../server/db/client.js';
import { migrateDatabase } from '../../server/db/migrate.js';

export interface TestDatabase extends DatabaseHandle {
  url: string;
  name: string;
  reset(): Promise<void>;
  drop(): Promise<void>;
}

export function testServerUrl(): string {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run the tests with `npm test`');
  return url;
}

export async function createTestDatabase(): Promise<TestDatabase> {
  const serverUrl = testServerUrl();
  const name = `t_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = await mysql.createConnection(serverUrl);
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4`);
  await admin.end();
  const url = `${serverUrl}/${name}`;
  const handle = openDatabase(url, 5);
  await migrateDatabase(handle.db);
  return {
    ...handle,
    url,
    name,
    async reset() {
      const [rows] = await handle.pool.query(
        `SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? AND table_name <> '__drizzle_migrations'`,
        [name],
      );
      const conn = await handle.pool.getConnection();
      try {
        await conn.query('SET FOREIGN_KEY_CHECKS = 0');
        for (const { t } of rows as { t: string }[]) await conn.query(`TRUNCATE TABLE \`${t}\``);
        await conn.query('SET FOREIGN_KEY_CHECKS = 1');
      } finally {
        conn.release();
      }
    },
    async drop() {
      await handle.close();
      const conn = await mysql.createConnection(serverUrl);
      await conn.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await conn.end();
    },
  };
}
