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
});

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
};

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
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
  };
}
