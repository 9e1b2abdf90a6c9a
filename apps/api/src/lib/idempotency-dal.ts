import type { Knex } from 'knex';

// Idempotency keys are tenant data: a key belongs to one person acting in one firm.
export interface StoredRow {
  route: string;
  request_hash: string | null;
  status_code: number;
  response_body: string | object;
}

export async function insertKey(
  trx: Knex.Transaction,
  row: { firmId: number; userId: number; key: string; route: string; requestHash: string },
): Promise<number> {
  const [id] = await trx('idempotency_keys').insert({
    firm_id: row.firmId,
    user_id: row.userId,
    idempotency_key: row.key,
    route: row.route,
    request_hash: row.requestHash,
    status_code: 0,
    response_body: 'null',
  });
  return id as number;
}

export async function storeAnswer(trx: Knex.Transaction, id: number, status: number, body: unknown): Promise<void> {
  await trx('idempotency_keys')
    .where({ id })
    .update({ status_code: status, response_body: JSON.stringify(body) });
}

export function findStored(db: Knex, firmId: number, userId: number, key: string): Promise<StoredRow | undefined> {
  return db('idempotency_keys')
    .where({ firm_id: firmId, user_id: userId, idempotency_key: key })
    .first<StoredRow | undefined>('route', 'request_hash', 'status_code', 'response_body');
}
