/** Server configuration from the environment, validated once at start. */
import { randomBytes } from 'node:crypto';
import { z } from 'zod';

const configSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  /** Public origin of the app, used in e-mailed links and the cross-site request check. */
  APP_ORIGIN: z.url().optional(),
  DATABASE_URL: z.string().optional(),
  /** Secret for session tokens; a random one per process when unset (sessions end on restart). */
  JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters').optional(),
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Byrecast <no-reply@byrecast.test>'),
  DATA_DIR: z.string().default('.data'),
  DIST_DIR: z.string().default('dist'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(12),
});

export interface AppConfig {
  env: 'development' | 'production' | 'test';
  port: number;
  host: string;
  appOrigin: string;
  jwtSecret: string;
  smtpUrl: string | undefined;
  mailFrom: string;
  dataDir: string;
  distDir: string;
  logLevel: string;
  bcryptCost: number;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env, overrides: Partial<AppConfig> = {}): AppConfig {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid configuration:\n${lines}`);
  }
  const c = parsed.data;
  return {
    env: c.NODE_ENV,
    port: c.PORT,
    host: c.HOST,
    appOrigin: c.APP_ORIGIN ?? `http://127.0.0.1:${c.PORT}`,
    jwtSecret: c.JWT_SECRET ?? randomBytes(32).toString('hex'),
    smtpUrl: c.SMTP_URL,
    mailFrom: c.MAIL_FROM,
    dataDir: c.DATA_DIR,
    distDir: c.DIST_DIR,
    logLevel: c.LOG_LEVEL,
    bcryptCost: c.BCRYPT_COST,
    ...overrides,
  };
}
