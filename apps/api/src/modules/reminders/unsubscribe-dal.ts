import type { Knex } from 'knex';
import type { MarketingSuppression } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

/** Addresses compare without case: a suppression of Jo@Example.com stops jo@example.com. */
export const normaliseEmail = (email: string) => email.trim().toLowerCase();

export async function insertUnsubscribeToken(
  db: Db,
  row: { firmId: number; tokenHash: string; email: string },
): Promise<void> {
  await db('unsubscribe_tokens').insert({
    firm_id: row.firmId,
    token_hash: row.tokenHash,
    email: normaliseEmail(row.email),
  });
}

/** The token's firm and address; a token is looked up by its hash alone (it is the capability). */
export async function findUnsubscribeToken(db: Db, tokenHash: string) {
  return (await db('unsubscribe_tokens as t')
    .join('firms as f', 'f.id', 't.firm_id')
    .where('t.token_hash', tokenHash)
    .first('t.id', 't.firm_id as firmId', 't.email', 'f.name as firmName')) as
    { id: number; firmId: number; email: string; firmName: string } | undefined;
}

export async function markUnsubscribeTokenUsed(db: Db, firmId: number, id: number, now: Date): Promise<void> {
  await db('unsubscribe_tokens').where({ firm_id: firmId, id }).whereNull('used_at').update({ used_at: now });
}

/** Adds the address to the firm's list; an address already on it stays as it was (INSERT IGNORE on the unique key). */
export async function insertSuppression(
  db: Db,
  firmId: number,
  email: string,
  source: MarketingSuppression['source'],
): Promise<void> {
  await db('marketing_suppressions')
    .insert({ firm_id: firmId, email: normaliseEmail(email), source })
    .onConflict(['firm_id', 'email'])
    .ignore();
}

export async function findSuppression(
  db: Db,
  firmId: number,
  email: string,
): Promise<MarketingSuppression | undefined> {
  const row = (await db('marketing_suppressions')
    .where({ firm_id: firmId, email: normaliseEmail(email) })
    .first('id', 'email', 'source', 'created_at')) as
    { id: number; email: string; source: MarketingSuppression['source']; created_at: Date } | undefined;
  return row && { id: row.id, email: row.email, source: row.source, createdAt: row.created_at.toISOString() };
}

export async function isSuppressed(db: Db, firmId: number, email: string): Promise<boolean> {
  return (
    (await db('marketing_suppressions')
      .where({ firm_id: firmId, email: normaliseEmail(email) })
      .first('id')) !== undefined
  );
}

export async function listSuppressions(db: Db, firmId: number): Promise<MarketingSuppression[]> {
  const rows = (await db('marketing_suppressions')
    .where({ firm_id: firmId })
    .orderBy('id', 'desc')
    .select('id', 'email', 'source', 'created_at')) as {
    id: number;
    email: string;
    source: MarketingSuppression['source'];
    created_at: Date;
  }[];
  return rows.map((r) => ({ id: r.id, email: r.email, source: r.source, createdAt: r.created_at.toISOString() }));
}
