/** Opens the database, migrates, optionally seeds the demo, and listens. Used by start, dev and tests. */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from './app.js';
import { loadConfig, type AppConfig } from './config.js';
import { openDatabase } from './db/client.js';
import { migrateDatabase } from './db/migrate.js';
import { seedDemoData, type SeedResult } from './demo/seed.js';
import { createLogger } from './logger.js';
import { createMailer } from './mail/index.js';

/** No query of a request takes near this long on a healthy database; a frozen one answers 503 after it. */
export const QUERY_DEADLINE_MS = 10_000;

export interface RunningServer {
  url: string;
  server: Server;
  seed: SeedResult | null;
  close(): Promise<void>;
}

export async function startServer(options: {
  databaseUrl: string;
  config?: AppConfig;
  seedDemo?: boolean;
}): Promise<RunningServer> {
  const config = options.config ?? loadConfig();
  const logger = createLogger(config.logLevel);
  const { db, pool, limitQueryTime, close: closeDb } = openDatabase(options.databaseUrl);
  await migrateDatabase(db);
  const seed = options.seedDemo ? await seedDemoData(db, { bcryptCost: config.bcryptCost }) : null;
  limitQueryTime(QUERY_DEADLINE_MS);
  const mailer = await createMailer(config, logger);
  const app = createApp({ db, pool, config, logger, mailer });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.on('error', reject);
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://${config.host}:${port}`,
    server,
    seed,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await mailer.close();
      await closeDb();
    },
  };
}
