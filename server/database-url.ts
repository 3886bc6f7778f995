/**
 * Where the app's database lives: DATABASE_URL when set (a managed or replicated MariaDB; we
 * start nothing), else a private MariaDB under .data/ started for this process and restarted
 * when it dies.
 */
import { join } from 'node:path';
import { startLocalMariadb } from './db/local-server.js';

export interface DatabaseLocation {
  url: string;
  stop(): Promise<void>;
}

export async function resolveDatabase(dataDir: string): Promise<DatabaseLocation> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, stop: async () => {} };
  const port = process.env.DB_PORT ? Number(process.env.DB_PORT) : undefined;
  // Supervised: if the private server dies, it comes back on the same port and data; the app's
  // pool answers 503 meanwhile and reconnects by itself.
  const local = await startLocalMariadb({ dataDir: join(dataDir, 'mariadb'), port, database: 'byrecast', supervise: true });
  return { url: `${local.serverUrl}/byrecast`, stop: local.stop };
}

/** Runs `stop` once on Ctrl-C, SIGTERM or exit of the parent. */
export function stopOnSignals(stop: () => Promise<void>): void {
  let stopping = false;
  const handler = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n${signal}: stopping …`);
    stop()
      .catch((error: unknown) => console.error(error))
      .finally(() => process.exit(0));
  };
  process.on('SIGINT', () => handler('SIGINT'));
  process.on('SIGTERM', () => handler('SIGTERM'));
  process.on('SIGHUP', () => handler('SIGHUP'));
}
