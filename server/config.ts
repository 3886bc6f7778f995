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
  /** Sign-in and password-reset requests allowed per e-mail address and per IP in each window. */
  RATE_LIMIT_WINDOW_MINUTES: z.coerce.number().int().min(1).max(1440).default(15),
  RATE_LIMIT_PER_EMAIL: z.coerce.number().int().min(1).default(10),
  RATE_LIMIT_PER_IP: z.coerce.number().int().min(1).default(100),
  /** Where uploaded documents live: `local` (under DATA_DIR/files) or `s3` (S3-compatible store). */
  STORAGE: z.enum(['local', 's3']).default('local'),
  S3_ENDPOINT: z.url().optional(),
  S3_BUCKET: z.string().min(3).optional(),
  S3_REGION: z.string().default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  /** Bytes of documents one farm may keep (all files together). */
  DOCUMENT_QUOTA_BYTES: z.coerce.number().int().min(0).default(500 * 1024 * 1024),
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
  rateLimit: { windowMinutes: number; perEmail: number; perIp: number };
  storage: StorageConfig;
  documentQuotaBytes: number;
}

export type StorageConfig =
  | { kind: 'local' }
  | { kind: 's3'; endpoint: string | undefined; bucket: string; region: string; accessKeyId: string | undefined; secretAccessKey: string | undefined };

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
    rateLimit: { windowMinutes: c.RATE_LIMIT_WINDOW_MINUTES, perEmail: c.RATE_LIMIT_PER_EMAIL, perIp: c.RATE_LIMIT_PER_IP },
    storage: storageConfig(c),
    documentQuotaBytes: c.DOCUMENT_QUOTA_BYTES,
    ...overrides,
  };
}

function storageConfig(c: z.infer<typeof configSchema>): StorageConfig {
  if (c.STORAGE === 'local') return { kind: 'local' };
  if (!c.S3_BUCKET) throw new Error('Invalid configuration:\n  S3_BUCKET: required when STORAGE=s3');
  return {
    kind: 's3',
    endpoint: c.S3_ENDPOINT,
    bucket: c.S3_BUCKET,
    region: c.S3_REGION,
    accessKeyId: c.S3_ACCESS_KEY_ID,
    secretAccessKey: c.S3_SECRET_ACCESS_KEY,
  };
}
