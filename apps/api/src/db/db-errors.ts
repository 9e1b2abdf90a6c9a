const unavailableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
]);

/** True when an error means the database cannot be reached, as opposed to a bad query. */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { code?: string; name?: string; fatal?: boolean; errors?: unknown[] };
  if (e.name === 'KnexTimeoutError') return true;
  if (e.code && unavailableCodes.has(e.code)) return true;
  if (e.fatal === true) return true;
  // mysql2 may wrap several connection attempts in an AggregateError.
  if (Array.isArray(e.errors)) return e.errors.some(isDatabaseUnavailable);
  return false;
}

const deadlockCodes = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT']);
export function isRetryableTransactionError(err: unknown): boolean {
  return !!err && typeof err === 'object' && deadlockCodes.has((err as { code?: string }).code ?? '');
}
