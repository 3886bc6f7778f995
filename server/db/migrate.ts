import { fileURLToPath } from 'node:url';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import type { Database } from './client.js';

const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url));

/** Applies every migration in drizzle/ that the database has not seen. */
export async function migrateDatabase(db: Database): Promise<void> {
  await migrate(db, { migrationsFolder });
}
