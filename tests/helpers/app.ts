/** An Express app on a fresh test database, with an in-memory outbox, for supertest. */
import type { Express } from 'express';
import { createApp, type AppDeps } from '../../server/app.js';
import { loadConfig, type AppConfig } from '../../server/config.js';
import { seedDemoData } from '../../server/demo/seed.js';
import { createLogger } from '../../server/logger.js';
import { createMemoryMailer, type Mailer } from '../../server/mail/mailer.js';
import { createTestDatabase, type TestDatabase } from './database.js';

export interface TestApp {
  app: Express;
  deps: AppDeps;
  database: TestDatabase;
  mailer: Mailer;
  config: AppConfig;
  close(): Promise<void>;
}

/** Low bcrypt cost keeps the tests fast; the production default (12) is tested on its own. */
export function testConfig(overrides: Partial<AppConfig> = {}): AppConfig {
  return loadConfig(
    { NODE_ENV: 'test', LOG_LEVEL: 'silent', BCRYPT_COST: '4', APP_ORIGIN: 'http://127.0.0.1:3999' },
    overrides,
  );
}

export async function createTestApp(options: { seedDemo?: boolean; config?: Partial<AppConfig> } = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const config = testConfig(options.config);
  const logger = createLogger('silent');
  const mailer = createMemoryMailer(config.mailFrom);
  if (options.seedDemo) await seedDemoData(database.db, { bcryptCost: 4 });
  const deps: AppDeps = { db: database.db, pool: database.pool, config, logger, mailer };
  return {
    app: createApp(deps),
    deps,
    database,
    mailer,
    config,
    close: () => database.drop(),
  };
}
