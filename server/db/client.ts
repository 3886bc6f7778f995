import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2';
import mysql from 'mysql2/promise';
import * as schema from './schema/index.js';

export type Database = MySql2Database<typeof schema>;

export interface DatabaseHandle {
  db: Database;
  pool: mysql.Pool;
  /** From now on, a query unanswered for `ms` ends its connection (see queryWatchdog). */
  limitQueryTime(ms: number): void;
  close(): Promise<void>;
}

/** Opens a connection pool; `mode: 'planetscale'` because MariaDB lacks LATERAL joins. */
export function openDatabase(url: string, connectionLimit = 10): DatabaseHandle {
  // A stopped database must answer in seconds (503), not hang a request: short connect timeout.
  // No `trace`: it captures a stack trace on every query (about a fifth of a short query's CPU
  // time), for a database error's stack to name the caller; errors keep their code and message.
  const pool = mysql.createPool({ uri: url, connectionLimit, timezone: 'Z', dateStrings: false, connectTimeout: 2_000, trace: false });
  const db = drizzle({ client: pool, schema, mode: 'planetscale' });
  const watchdog = queryWatchdog(pool);
  return {
    db,
    pool,
    limitQueryTime: watchdog.setDeadline,
    close: () => {
      watchdog.stop();
      return pool.end();
    },
  };
}

/** The parts of a mysql2 core connection the watchdog reads (not in mysql2's typings). */
interface WatchedConnection {
  _command?: { waitedMs?: number } | null;
  stream: { destroy(error: Error): void };
  once(event: 'end' | 'error', listener: () => void): void;
}

const WATCH_TICK_MS = 250;

/**
 * Ends a pooled connection whose query has gone unanswered for the deadline: a server that is
 * frozen or cut off (no reset, so TCP would wait for minutes) fails the request with a
 * connection error, which answers 503, and the pool opens a fresh connection next time. Every
 * connection is watched from its start; the deadline applies once set (after the migrations,
 * which may rightly take longer). Waiting is counted in ticks of at most two intervals, so a
 * stretch where our own event loop was busy (a long calculation) never counts against the
 * database: its answer may be sitting unread in the socket.
 */
function queryWatchdog(pool: mysql.Pool): { setDeadline(ms: number): void; stop(): void } {
  const core = (pool as unknown as { pool: { on(event: 'connection', listener: (c: WatchedConnection) => void): void } }).pool;
  const live = new Set<WatchedConnection>();
  core.on('connection', (connection) => {
    live.add(connection);
    connection.once('end', () => live.delete(connection));
    connection.once('error', () => live.delete(connection));
  });
  let timer: NodeJS.Timeout | null = null;
  return {
    setDeadline(ms) {
      if (timer) clearInterval(timer);
      let lastTick = Date.now();
      timer = setInterval(() => {
        const now = Date.now();
        const step = Math.min(now - lastTick, 2 * WATCH_TICK_MS);
        lastTick = now;
        for (const connection of live) {
          const command = connection._command;
          if (!command) continue;
          command.waitedMs = (command.waitedMs ?? 0) + step;
          if (command.waitedMs < ms) continue;
          live.delete(connection);
          connection.stream.destroy(Object.assign(new Error(`The database did not answer within ${ms / 1000} s`), { code: 'ETIMEDOUT' }));
        }
      }, WATCH_TICK_MS);
      timer.unref();
    },
    stop() {
      if (timer) clearInterval(timer);
    },
  };
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
