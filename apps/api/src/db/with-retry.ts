import { isRetryableTransactionError } from './db-errors.ts';

/**
 * Runs a whole transaction again when MariaDB chose it as a deadlock victim or its lock wait
 * ran out: the work is re-read from scratch, so a retry never applies a stale decision.
 */
export async function withTransactionRetry<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await work();
    } catch (err) {
      if (attempt >= attempts || !isRetryableTransactionError(err)) throw err;
      await new Promise((r) => setTimeout(r, 10 * attempt + Math.random() * 20));
    }
  }
}
