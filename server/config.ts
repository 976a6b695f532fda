import path from 'node:path';
import { z } from 'zod';
import type { LogSettings } from './logger';
import { defaultThreadCount } from './services/thread-budget';

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
  /** Secure session cookie with the __Host- prefix; on by default in production, where it cannot be turned off. */
  COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  SIGNIN_MAX_FAILURES_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
  SIGNIN_MAX_FAILURES_PER_IP: z.coerce.number().int().positive().default(30),
  SIGNIN_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  /** After SIGNIN_MAX_FAILURES_PER_ACCOUNT failures, each attempt waits a doubling delay from this, up to the maximum. */
  SIGNIN_BACKOFF_BASE_MS: z.coerce.number().int().positive().default(1000),
  SIGNIN_BACKOFF_MAX_SECONDS: z.coerce.number().positive().default(30),
  /** Sign-up requests per client address and per e-mail address in an hour; more answer 429. */
  SIGNUPS_PER_IP_PER_HOUR: z.coerce.number().int().positive().default(10),
  SIGNUPS_PER_ADDRESS_PER_HOUR: z.coerce.number().int().positive().default(3),
  // The payment service, reached only through its SDK; locally the fake in stripe-fake/.
  STRIPE_API_HOST: z.string().min(1).default('127.0.0.1'),
  STRIPE_API_PORT: z.coerce.number().int().min(1).max(65535).default(12111),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).default('http'),
  STRIPE_SECRET_KEY: z.string().startsWith('sk_').default('sk_test_local_tarnish'),
  STRIPE_WEBHOOK_SECRET: z.string().startsWith('whsec_').default('whsec_local_tarnish'),
  STRIPE_PRICE_MONTHLY: z.string().min(1).default('seat_monthly'),
  STRIPE_PRICE_YEARLY: z.string().min(1).default('seat_yearly'),
  // Outgoing mail; locally the catcher started by scripts/serve-local.ts.
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Tarnish <no-reply@tarnish.localhost>'),
  MAILS_PER_ADDRESS_PER_HOUR: z.coerce.number().int().positive().default(5),
  /**
   * Worker threads shared by every pool (runs, lab, PDFs); 0 = one fewer than the machine's cores
   * (at least 1), keeping a core for the API.
   */
  WORKER_THREADS: z.coerce.number().int().min(0).max(64).default(0),
  /** The Redis the job queue lives on (every API and worker process of one installation points at the same). */
  REDIS_HOST: z.string().min(1).default('127.0.0.1'),
  REDIS_PORT: z.coerce.number().int().min(1).max(65535).default(6379),
  REDIS_PASSWORD: z.string().optional(),
  REDIS_DB: z.coerce.number().int().min(0).max(15).default(0),
  /** Prefix of every queue key, so installations (or test files) can share one Redis. */
  QUEUE_PREFIX: z.string().regex(/^[a-z0-9-]+$/).default('tarnish'),
  /**
   * How long a worker's hold on a job lasts without being renewed: a worker that dies (killed, machine
   * lost) gives its jobs back to the queue after about this long, and another worker takes them.
   */
  QUEUE_LOCK_SECONDS: z.coerce.number().positive().max(600).default(30),
  /** Simulations one organisation may have running at once across every worker; the rest wait (fairness). */
  ORGANISATION_CONCURRENCY: z.coerce.number().int().min(1).max(1000).default(8),
  /** Folder for uploaded geodata files and the maps drawn from them (one subfolder per organisation). */
  GEODATA_DIR: z.string().min(1).default('.local/geodata'),
  /** Uploads (file reads and stores) one organisation may have in progress at once; more answer 429. */
  UPLOADS_PER_ORGANISATION: z.coerce.number().int().min(1).max(50).default(2),
  /** How long a shutdown waits for requests being answered before it cuts them. */
  SHUTDOWN_GRACE_SECONDS: z.coerce.number().positive().max(120).default(5),
  /** The structured log (JSON lines): its level, and a file to append to instead of standard output. */
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'silent']).optional(),
  LOG_FILE: z.string().min(1).optional(),
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
    signInLimits: { perAccount: number; perIp: number; windowMs: number; backoffBaseMs: number; backoffMaxMs: number };
    signUpLimits: { perIpPerHour: number; perAddressPerHour: number };
  };
  billing: {
    host: string;
    port: number;
    protocol: 'http' | 'https';
    secretKey: string;
    webhookSecret: string;
    /** Price lookup keys of the seat plans offered. */
    prices: { monthly: string; yearly: string };
  };
  mail: {
    host: string;
    port: number;
    secure: boolean;
    auth?: { user: string; pass: string };
    from: string;
    perAddressPerHour: number;
  };
  /** Worker threads all pools share (see server/services/thread-budget.ts). */
  workerThreads: number;
  queue: {
    redis: { host: string; port: number; password?: string; db: number };
    prefix: string;
    lockMs: number;
    organisationConcurrency: number;
  };
  geodata: { dir: string };
  uploads: { perOrganisation: number };
  shutdownGraceMs: number;
  log: LogSettings;
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
  if (e.NODE_ENV === 'production' && (e.STRIPE_SECRET_KEY.includes('local') || e.STRIPE_WEBHOOK_SECRET.includes('local'))) {
    throw new Error('Invalid server configuration:\n  STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET: must be set in production');
  }
  const cookieSecure = e.COOKIE_SECURE === undefined ? e.NODE_ENV === 'production' : e.COOKIE_SECURE === 'true';
  if (e.NODE_ENV === 'production') {
    // A Secure, __Host- cookie only travels over HTTPS: production must be reached through TLS.
    const problems = [
      ...(cookieSecure ? [] : ['  COOKIE_SECURE: must not be false in production (the session cookie must be Secure)']),
      ...(e.PUBLIC_URL?.startsWith('https://') ? [] : ['  PUBLIC_URL: must be the https:// address users reach in production (TLS in front of the app)']),
    ];
    if (problems.length > 0) throw new Error(`Invalid server configuration:\n${problems.join('\n')}`);
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
      cookieSecure,
      signInLimits: {
        perAccount: e.SIGNIN_MAX_FAILURES_PER_ACCOUNT,
        perIp: e.SIGNIN_MAX_FAILURES_PER_IP,
        windowMs: e.SIGNIN_WINDOW_MINUTES * 60_000,
        backoffBaseMs: e.SIGNIN_BACKOFF_BASE_MS,
        backoffMaxMs: e.SIGNIN_BACKOFF_MAX_SECONDS * 1000,
      },
      signUpLimits: { perIpPerHour: e.SIGNUPS_PER_IP_PER_HOUR, perAddressPerHour: e.SIGNUPS_PER_ADDRESS_PER_HOUR },
    },
    billing: {
      host: e.STRIPE_API_HOST,
      port: e.STRIPE_API_PORT,
      protocol: e.STRIPE_API_PROTOCOL,
      secretKey: e.STRIPE_SECRET_KEY,
      webhookSecret: e.STRIPE_WEBHOOK_SECRET,
      prices: { monthly: e.STRIPE_PRICE_MONTHLY, yearly: e.STRIPE_PRICE_YEARLY },
    },
    mail: {
      host: e.SMTP_HOST,
      port: e.SMTP_PORT,
      secure: e.SMTP_SECURE,
      auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD ?? '' } : undefined,
      from: e.MAIL_FROM,
      perAddressPerHour: e.MAILS_PER_ADDRESS_PER_HOUR,
    },
    workerThreads: e.WORKER_THREADS || defaultThreadCount(),
    queue: {
      redis: { host: e.REDIS_HOST, port: e.REDIS_PORT, password: e.REDIS_PASSWORD, db: e.REDIS_DB },
      prefix: e.QUEUE_PREFIX,
      lockMs: e.QUEUE_LOCK_SECONDS * 1000,
      organisationConcurrency: e.ORGANISATION_CONCURRENCY,
    },
    geodata: { dir: path.resolve(e.GEODATA_DIR) },
    uploads: { perOrganisation: e.UPLOADS_PER_ORGANISATION },
    shutdownGraceMs: e.SHUTDOWN_GRACE_SECONDS * 1000,
    // Tests log only errors unless asked (the API suite captures every request in a file: tests/setup/api-log.ts).
    log: { level: e.LOG_LEVEL ?? (e.NODE_ENV === 'test' ? 'error' : 'info'), file: e.LOG_FILE, sync: e.NODE_ENV === 'test' },
  };
}

let cached: AppConfig | undefined;
/** The process-wide config, parsed on first use. */
export function loadConfig(): AppConfig {
  cached ??= parseConfig(process.env);
  return cached;
}
