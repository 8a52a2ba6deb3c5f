import path from 'node:path';
import { z } from 'zod';

/** The server's configuration, parsed from the environment once at start-up; an invalid value stops the start. */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().url({ message: 'DATABASE_URL must be a postgres:// URL' }),
  SESSION_SECRET: z.string().min(16).optional(),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(5).max(24 * 60).default(120),
  LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  LOGIN_RATE_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Set when Mendstep is served over HTTPS (directly or behind a TLS proxy): cookies become Secure. */
  TLS: z
    .enum(['0', '1', 'true', 'false'])
    .default('0')
    .transform((v) => v === '1' || v === 'true'),
  TRUST_PROXY: z.coerce.number().int().min(0).default(0),
  /** Where e-mailed links point (the address staff open Mendstep at); required in production. */
  APP_URL: z.string().url({ message: 'APP_URL must be a URL such as https://mendstep.example.org' }).optional(),
  /** The SMTP server to send through; required in production. Unset elsewhere: a local fake server receives everything. */
  SMTP_HOST: z.string().min(1).optional(),
  /** The SMTP server's port; for the local fake server, the port it listens on (0 = any free port). */
  SMTP_PORT: z.coerce.number().int().min(0).max(65535).optional(),
  SMTP_SECURE: z.enum(['0', '1', 'true', 'false']).default('0').transform((v) => v === '1' || v === 'true'),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASSWORD: z.string().min(1).optional(),
  SMTP_FROM: z.string().min(3).default('Mendstep <no-reply@mendstep.invalid>'),
  /** 0 turns the local fake SMTP server off (messages then wait in the outbox); never on in production. */
  MAIL_FAKE: z.enum(['0', '1', 'true', 'false']).optional(),
  /** How often the outbox is swept for due messages; 0 = only messages this process queued (the test default). */
  MAIL_POLL_SECONDS: z.coerce.number().min(0).optional(),
  /** First retry delay after a failed send; it doubles per attempt up to 15 minutes. */
  MAIL_RETRY_SECONDS: z.coerce.number().min(0.05).default(30),
  PASSWORD_RESET_RATE_LIMIT: z.coerce.number().int().min(1).default(5),
  PASSWORD_RESET_RATE_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  STORAGE_DRIVER: z.enum(['local', 's3']).default('local'),
  /** The local driver's folder, relative to the checkout unless absolute. */
  STORAGE_DIR: z.string().min(1).default('.data/uploads'),
  S3_BUCKET: z.string().min(1).optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ENDPOINT: z.string().url({ message: 'S3_ENDPOINT must be a URL' }).optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  S3_FORCE_PATH_STYLE: z.enum(['0', '1', 'true', 'false']).optional(),
});

const flag = (value: string | undefined) => (value === undefined ? undefined : value === '1' || value === 'true');

export type MailConfig = {
  /** null: no real SMTP server configured. */
  smtpHost: string | null;
  smtpPort: number;
  smtpSecure: boolean;
  smtpUser: string | null;
  smtpPassword: string | null;
  from: string;
  /** Start the local fake SMTP server (outside production, when no SMTP host is set). */
  fakeServer: boolean;
  pollSeconds: number;
  retrySeconds: number;
};

export type StorageConfig =
  | { driver: 'local'; dir: string }
  | { driver: 's3'; bucket: string; region: string; endpoint: string | null; accessKeyId: string | null; secretAccessKey: string | null; forcePathStyle: boolean };

export type Config = {
  env: 'development' | 'test' | 'production';
  port: number;
  host: string;
  databaseUrl: string;
  sessionSecret: string;
  sessionIdleMinutes: number;
  loginRateLimit: number;
  loginRateWindowMinutes: number;
  logLevel: string;
  secureCookies: boolean;
  trustProxy: number;
  appUrl: string;
  /** False when APP_URL was not given and `appUrl` is the local default. */
  appUrlConfigured: boolean;
  mail: MailConfig;
  storage: StorageConfig;
  passwordResetRateLimit: number;
  passwordResetRateWindowMinutes: number;
};

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  assertProductionEssentials(env);
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid configuration: ${problems}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET) {
    throw new Error('Invalid configuration: SESSION_SECRET is required in production (at least 16 characters)');
  }
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    host: e.HOST,
    databaseUrl: e.DATABASE_URL,
    // Outside production a fixed secret keeps demo sessions across restarts; production must set its own.
    sessionSecret: e.SESSION_SECRET ?? 'mendstep-local-demo-secret-not-for-production',
    sessionIdleMinutes: e.SESSION_IDLE_MINUTES,
    loginRateLimit: e.LOGIN_RATE_LIMIT,
    loginRateWindowMinutes: e.LOGIN_RATE_WINDOW_MINUTES,
    logLevel: e.LOG_LEVEL,
    secureCookies: e.NODE_ENV === 'production' || e.TLS,
    trustProxy: e.TRUST_PROXY,
    ...mailAndStorage(e),
  };
}

function mailAndStorage(e: z.infer<typeof envSchema>) {
  const production = e.NODE_ENV === 'production';
  if (production && flag(e.MAIL_FAKE)) throw new Error('Invalid configuration: MAIL_FAKE cannot be on in production');
  if (e.STORAGE_DRIVER === 's3' && !e.S3_BUCKET) throw new Error('Invalid configuration: S3_BUCKET is required when STORAGE_DRIVER=s3');
  const fakeServer = !production && !e.SMTP_HOST && flag(e.MAIL_FAKE) !== false;
  const localHost = e.HOST === '0.0.0.0' || e.HOST === '::' ? '127.0.0.1' : e.HOST;
  const mail: MailConfig = {
    smtpHost: e.SMTP_HOST ?? null,
    // The fake server listens on 2525 (any free port in tests); a real server is reached on submission port 587.
    smtpPort: e.SMTP_PORT ?? (e.SMTP_HOST ? (e.SMTP_SECURE ? 465 : 587) : e.NODE_ENV === 'test' ? 0 : 2525),
    smtpSecure: e.SMTP_SECURE,
    smtpUser: e.SMTP_USER ?? null,
    smtpPassword: e.SMTP_PASSWORD ?? null,
    from: e.SMTP_FROM,
    fakeServer,
    // Test processes share one database: each sends only what it queued, so one test's outage is its own.
    pollSeconds: e.MAIL_POLL_SECONDS ?? (e.NODE_ENV === 'test' ? 0 : 15),
    retrySeconds: e.MAIL_RETRY_SECONDS,
  };
  const storage: StorageConfig =
    e.STORAGE_DRIVER === 's3'
      ? {
          driver: 's3',
          bucket: e.S3_BUCKET!,
          region: e.S3_REGION,
          endpoint: e.S3_ENDPOINT ?? null,
          accessKeyId: e.S3_ACCESS_KEY_ID ?? null,
          secretAccessKey: e.S3_SECRET_ACCESS_KEY ?? null,
          forcePathStyle: flag(e.S3_FORCE_PATH_STYLE) ?? Boolean(e.S3_ENDPOINT),
        }
      : { driver: 'local', dir: path.resolve(import.meta.dirname, '..', e.STORAGE_DIR) };
  return {
    appUrl: (e.APP_URL ?? `${e.TLS ? 'https' : 'http'}://${localHost}:${e.PORT}`).replace(/\/+$/, ''),
    appUrlConfigured: Boolean(e.APP_URL),
    mail,
    storage,
    passwordResetRateLimit: e.PASSWORD_RESET_RATE_LIMIT,
    passwordResetRateWindowMinutes: e.PASSWORD_RESET_RATE_WINDOW_MINUTES,
  };
}

/**
 * What a deployment must set before it serves anyone: e-mailed links and mail delivery cannot fall back to
 * local defaults in production. Checked when the server process starts (server/index.ts).
 */
export function assertDeployable(config: Config): void {
  if (config.env !== 'production') return;
  const missing = [!config.mail.smtpHost && 'SMTP_HOST', !config.appUrlConfigured && 'APP_URL'].filter(Boolean);
  if (missing.length) throw new Error(`Invalid configuration: ${missing.join(' and ')} must be set in production`);
}

/**
 * Production never falls back to demo values: it needs its own session secret and a database it was told
 * about. `npm start` (scripts/start.sh) may start the local cluster for a single-machine install, but only
 * when ALLOW_LOCAL_DATABASE=1 says so, and it then sets DATABASE_URL itself.
 */
function assertProductionEssentials(env: NodeJS.ProcessEnv): void {
  if (env.NODE_ENV !== 'production') return;
  const missing = [
    !env.SESSION_SECRET && 'SESSION_SECRET (at least 16 characters)',
    !env.DATABASE_URL && 'DATABASE_URL (a managed PostgreSQL; or ALLOW_LOCAL_DATABASE=1 with npm start to use the local cluster)',
  ].filter(Boolean);
  if (missing.length) throw new Error(`Invalid configuration: production needs ${missing.join(' and ')}`);
}
