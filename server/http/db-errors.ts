// What "the database is away" looks like from mysql2 and Knex: a refused or lost connection, a
// server shutting down, or no pooled connection within acquireConnectionTimeout.
const unavailableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENOTFOUND',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_CON_COUNT_ERROR',
]);

/** Whether an error means the database cannot be reached (a 503), not that a query was wrong. */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false;
  const { code, fatal, name } = error as { code?: unknown; fatal?: unknown; name?: unknown };
  if (name === 'KnexTimeoutError') return true;
  if (typeof code === 'string' && unavailableCodes.has(code)) return true;
  // mysql2 marks connection-level failures fatal; a wrong query is never fatal.
  return fatal === true;
}
