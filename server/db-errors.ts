/**
 * What a database error means for the request, read from the driver's codes (mysql2 and
 * Knex's pool), never from its message.
 */
interface DriverError {
  code?: unknown;
  errno?: unknown;
  fatal?: unknown;
  name?: unknown;
}

const CONNECTION_CODES = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENOTFOUND', 'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST', 'PROTOCOL_SEQUENCE_TIMEOUT', 'ER_CON_COUNT_ERROR', 'ER_SERVER_SHUTDOWN',
  'ER_SERVER_GONE_ERROR', 'ER_SERVER_LOST', 'ER_NET_READ_ERROR', 'ER_NET_WRITE_INTERRUPTED', 'ER_QUERY_INTERRUPTED',
]);

/** The database cannot be reached (refused, lost, shut down, or the pool timed out waiting for a connection). */
export function isConnectionLoss(error: unknown): boolean {
  const e = (error ?? {}) as DriverError;
  if (e.name === 'KnexTimeoutError') return true;
  return (typeof e.code === 'string' && CONNECTION_CODES.has(e.code)) || e.fatal === true;
}

/** A unique key refused the write (ER_DUP_ENTRY, errno 1062). */
export const isUniqueViolation = (error: unknown): boolean => {
  const e = (error ?? {}) as DriverError;
  return e.code === 'ER_DUP_ENTRY' || e.errno === 1062;
};

/** The transaction was rolled back by a deadlock or a lock wait timeout; nothing was stored. */
export const isLockFailure = (error: unknown): boolean => {
  const e = (error ?? {}) as DriverError;
  return e.code === 'ER_LOCK_DEADLOCK' || e.code === 'ER_LOCK_WAIT_TIMEOUT';
};
