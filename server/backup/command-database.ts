/**
 * The database a backup or restore command works on, found the way `npm start` finds it
 * (server/database-url.ts): DATABASE_URL when set; otherwise the private MariaDB under
 * DATA_DIR/mariadb — reached through its socket while `npm start` runs, or started for the
 * command (and stopped after) when it does not.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { startLocalMariadb } from '../db/local-server.js';
import type { DatabaseTarget } from '../db/dump.js';

export const PRIVATE_DATABASE = 'byrecast';

export interface CommandDatabase {
  target: DatabaseTarget;
  /** Said in the command's report: which database this is. */
  description: string;
  /** The process (`npm start` or `npm run dev`) serving the private database now, if any. */
  inUseBy: number | null;
  release(): Promise<void>;
}

function runningPid(pidFile: string): number | null {
  if (!existsSync(pidFile)) return null;
  const pid = Number(readFileSync(pidFile, 'utf8').trim());
  try {
    if (pid) process.kill(pid, 0);
    return pid || null;
  } catch {
    return null;
  }
}

/** `create`: whether a private MariaDB may be made when there is none yet (restore onto a new machine). */
export async function commandDatabase(dataDir: string, options: { create: boolean; env?: NodeJS.ProcessEnv }): Promise<CommandDatabase> {
  const env = options.env ?? process.env;
  if (env.DATABASE_URL) {
    const url = new URL(env.DATABASE_URL);
    return { target: { url: env.DATABASE_URL }, description: `database ${url.pathname.slice(1)} on ${url.host} (DATABASE_URL)`, inUseBy: null, release: async () => {} };
  }
  const dir = resolve(dataDir, 'mariadb');
  const socketPath = join(dir, 'mariadb.sock');
  const target = { socketPath, database: PRIVATE_DATABASE };
  const description = `database ${PRIVATE_DATABASE} of the private MariaDB in ${dir}`;
  if (runningPid(join(dir, 'mariadb.pid')) && existsSync(socketPath)) {
    const owner = runningPid(join(dir, 'owner.pid'));
    return { target, description: `${description} (running)`, inUseBy: owner !== process.pid ? owner : null, release: async () => {} };
  }
  if (!options.create && !existsSync(join(dir, 'db', 'mysql'))) {
    throw new Error(`No database found: DATABASE_URL is not set and there is no private MariaDB in ${dir} (run npm start once, or set DATA_DIR)`);
  }
  const local = await startLocalMariadb({ dataDir: dir, database: PRIVATE_DATABASE, quiet: true });
  return { target, description: `${description} (started for this command)`, inUseBy: null, release: local.stop };
}
