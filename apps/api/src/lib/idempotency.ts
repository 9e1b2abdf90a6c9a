import type { Request } from 'express';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../app-deps.ts';
import { HttpError } from './http-error.ts';

const keyPattern = /^[A-Za-z0-9_.:-]{8,100}$/;

export function idempotencyKeyOf(req: Request): string | undefined {
  const key = req.get('idempotency-key');
  if (key === undefined) return undefined;
  if (!keyPattern.test(key)) {
    throw new HttpError(422, 'The Idempotency-Key header must be 8 to 100 letters, digits or - _ . :', 'ValidationFailed', [
      { path: 'Idempotency-Key', message: 'Use a UUID.' },
    ]);
  }
  return key;
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
  key: string | undefined,
  route: string,
  work: (trx: Knex.Transaction) => Promise<{ status: number; body: T }>,
): Promise<{ status: number; body: T; replayed: boolean }> {
  if (!key) return { ...(await deps.db.transaction(work)), replayed: false };
  const existing = await findStored(deps.db, actor, key);
  if (existing) return replay(existing, route);
  let keyWritten = false;
  try {
    const result = await deps.db.transaction(async (trx) => {
      const [id] = await trx('idempotency_keys').insert({
        firm_id: actor.firmId,
        user_id: actor.userId,
        idempotency_key: key,
        route,
        status_code: 0,
        response_body: 'null',
      });
      keyWritten = true;
      const out = await work(trx);
      await trx('idempotency_keys').where({ id }).update({ status_code: out.status, response_body: JSON.stringify(out.body) });
      return out;
    });
    return { ...result, replayed: false };
  } catch (err) {
    if (keyWritten || !isDuplicate(err)) throw err;
    const stored = await findStored(deps.db, actor, key);
    if (!stored) throw err;
    return replay(stored, route);
  }
}

interface StoredRow {
  route: string;
  status_code: number;
  response_body: string | object;
}

async function findStored(db: Knex, actor: Actor, key: string): Promise<StoredRow | undefined> {
  return db('idempotency_keys').where({ firm_id: actor.firmId, user_id: actor.userId, idempotency_key: key }).first('route', 'status_code', 'response_body');
}

function replay<T>(row: StoredRow, route: string): { status: number; body: T; replayed: boolean } {
  if (row.route !== route) {
    throw new HttpError(409, 'That Idempotency-Key was already used for a different request.', 'IdempotencyKeyReused');
  }
  const body = typeof row.response_body === 'string' ? JSON.parse(row.response_body) : row.response_body;
  return { status: row.status_code, body: body as T, replayed: true };
}
