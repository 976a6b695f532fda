import pino, { type Logger } from 'pino';

export type { Logger };

export interface LogSettings {
  level: 'fatal' | 'error' | 'warn' | 'info' | 'debug' | 'silent';
  /** Append JSON lines to this file instead of standard output (tests capture the log this way). */
  file?: string;
  /** Write each line at once (tests read the log); otherwise lines are buffered in 4 kB writes, flushed on exit. */
  sync: boolean;
}

/**
 * Fields that must never reach the log whatever object is logged: credentials and the
 * addresses of people. Serializers below log only ids, routes and codes; this is the net
 * under them.
 */
const REDACTED_PATHS = [
  'req.headers.cookie', 'req.headers.authorization', 'req.headers["stripe-signature"]', 'res.headers["set-cookie"]',
  '*.password', '*.currentPassword', '*.newPassword', '*.password_hash', '*.passwordHash', '*.token', '*.email', '*.to',
];

/** The parts of an error that are safe to keep: its kind and codes, and where it was thrown, never its message (a database error's message holds the statement's values). */
export function safeError(error: unknown): Record<string, unknown> {
  if (!(error instanceof Error)) return { type: typeof error };
  const e = error as Error & { code?: unknown; errno?: unknown; sqlState?: unknown; status?: unknown };
  const frames = (e.stack ?? '').split('\n').filter((line) => line.trimStart().startsWith('at ')).slice(0, 8).map((line) => line.trim());
  return { type: e.name, code: e.code, errno: e.errno, sqlState: e.sqlState, status: e.status, frames };
}

/** The structured logger (pino): JSON lines with a level, a time and, for requests, the request id. */
export function createLogger(settings: LogSettings): Logger {
  const options = {
    level: settings.level,
    redact: { paths: REDACTED_PATHS, censor: '[redacted]' },
    serializers: { err: safeError, error: safeError },
  };
  const destination = settings.file
    ? pino.destination({ dest: settings.file, append: true, mkdir: true, sync: settings.sync, minLength: settings.sync ? 0 : 4096 })
    : pino.destination({ dest: 1, sync: settings.sync, minLength: settings.sync ? 0 : 4096 });
  return pino(options, destination);
}
