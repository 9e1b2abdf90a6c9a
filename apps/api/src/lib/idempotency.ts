import { createHash } from 'node:crypto';
import type { Request } from 'express';
import type { Knex } from 'knex';
import { findStored, insertKey, storeAnswer, type StoredRow } from './idempotency-dal.ts';
import type { Actor, AppDeps } from '../app-deps.ts';
import { HttpError } from './http-error.ts';

const keyPattern = /^[A-Za-z0-9_.:-]{8,100}$/;

/** A request's Idempotency-Key with a fingerprint of the request it came with. */
export interface IdempotencyKey {
  key: string;
  /** SHA-256 of the method, path and body: the same key with another request is refused, not replayed. */
  requestHash: string;
}

export function idempotencyKeyOf(req: Request): IdempotencyKey | undefined {
  const key = req.get('idempotency-key');
  if (key === undefined) return undefined;
  if (!keyPattern.test(key)) {
    throw new HttpError(
      422,
      'The Idempotency-Key header must be 8 to 100 letters, digits or - _ . :',
      'ValidationFailed',
      [{ path: 'Idempotency-Key', message: 'Use a UUID.' }],
    );
  }
  const fingerprint = JSON.stringify([req.method, req.baseUrl + req.path, req.body ?? null]);
  return { key, requestHash: createHash('sha256').update(fingerprint).digest('hex') };
}

function isDuplicate(err: unknown): boolean {
  return (err as { code?: string } | null)?.code === 'ER_DUP_ENTRY';
}

/**
 * Runs `work` in a transaction at most once per (firm, person, key). The key row is written first,
 * so a concurrent retry waits on its unique index until the first commits, then replays the first
 * answer; a first attempt that fails leaves no row, so its retry runs afresh.
 */
export async function runIdempotent<T>(
  deps: AppDeps,
  actor: Actor,
  idempotencyKey: IdempotencyKey | undefined,
  route: string,
  work: (trx: Knex.Transaction) => Promise<{ status: number; body: T }>,
): Promise<{ status: number; body: T; replayed: boolean }> {
  if (!idempotencyKey) return { ...(await deps.db.transaction(work)), replayed: false };
  const { key, requestHash } = idempotencyKey;
  const existing = await findStored(deps.db, actor.firmId, actor.userId, key);
  if (existing) return replay(existing, route, requestHash);
  let keyWritten = false;
  try {
    const result = await deps.db.transaction(async (trx) => {
      const id = await insertKey(trx, { firmId: actor.firmId, userId: actor.userId, key, route, requestHash });
      keyWritten = true;
      const out = await work(trx);
      await storeAnswer(trx, id, out.status, out.body);
      return out;
    });
    return { ...result, replayed: false };
  } catch (err) {
    if (keyWritten || !isDuplicate(err)) throw err;
    const stored = await findStored(deps.db, actor.firmId, actor.userId, key);
    if (!stored) throw err;
    return replay(stored, route, requestHash);
  }
}

function replay<T>(row: StoredRow, route: string, requestHash: string): { status: number; body: T; replayed: boolean } {
  if (row.route !== route) {
    throw new HttpError(409, 'That Idempotency-Key was already used for a different request.', 'IdempotencyKeyReused');
  }
  // Rows written before the fingerprint was kept have none; they replay as before.
  if (row.request_hash !== null && row.request_hash !== requestHash) {
    throw new HttpError(
      422,
      'This save reused the reference of an earlier, different one, so it was not applied. Reload the page and enter it again.',
      'IdempotencyKeyMismatch',
      [{ path: 'Idempotency-Key', message: 'Send a new key for a new request.' }],
    );
  }
  const body = typeof row.response_body === 'string' ? JSON.parse(row.response_body) : row.response_body;
  return { status: row.status_code, body: body as T, replayed: true };
}
