import { z } from 'zod';

/**
 * Server settings, read from the environment once. Defaults suit the local set-up
 * started by `npm start`; production must set JWT_SECRET and the payment keys.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: z.string().url().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().min(1).default('tarnish'),
  DB_USER: z.string().min(1).default('tarnish'),
  DB_PASSWORD: z.string().default('tarnish-local-only'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  JWT_SECRET: z.string().min(32).default('local-only-secret-change-me-in-production-0123456789'),
  SESSION_HOURS: z.coerce.number().positive().max(24 * 30).default(12),
  COOKIE_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  SIGNIN_MAX_FAILURES_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
  SIGNIN_MAX_FAILURES_PER_IP: z.coerce.number().int().positive().default(30),
  SIGNIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
});

export type Env = z.infer<typeof envSchema>;

export interface AppConfig {
  env: Env['NODE_ENV'];
  host: string;
  port: number;
  publicUrl: string;
  db: { host: string; port: number; database: string; user: string; password: string; poolMax: number };
  auth: {
    jwtSecret: string;
    sessionHours: number;
    cookieSecure: boolean;
    signInLimits: { perAccount: number; perIp: number; windowMs: number };
  };
}

/** Parses an environment map into the typed config; throws one readable message listing every bad variable. */
export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid server configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && e.JWT_SECRET.startsWith('local-only')) {
    throw new Error('Invalid server configuration:\n  JWT_SECRET: must be set in production');
  }
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl: e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`,
    db: { host: e.DB_HOST, port: e.DB_PORT, database: e.DB_NAME, user: e.DB_USER, password: e.DB_PASSWORD, poolMax: e.DB_POOL_MAX },
    auth: {
      jwtSecret: e.JWT_SECRET,
      sessionHours: e.SESSION_HOURS,
      cookieSecure: e.COOKIE_SECURE,
      signInLimits: {
        perAccount: e.SIGNIN_MAX_FAILURES_PER_ACCOUNT,
        perIp: e.SIGNIN_MAX_FAILURES_PER_IP,
        windowMs: e.SIGNIN_WINDOW_MINUTES * 60_000,
      },
    },
  };
}

let cached: AppConfig | undefined;
/** The process-wide config, parsed on first use. */
export function loadConfig(): AppConfig {
  cached ??= parseConfig(process.env);
  return cached;
}
