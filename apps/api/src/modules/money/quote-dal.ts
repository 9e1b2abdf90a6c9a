import type { Knex } from 'knex';
import type { QuoteStatus } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface QuoteRow {
  id: number;
  firm_id: number;
  job_id: number;
  number: number;
  status: QuoteStatus;
  valid_until: string;
  vat_registered: number | boolean;
  notes: string | null;
  net_pence: number;
  vat_pence: number;
  total_pence: number;
  token_hash: string | null;
  token_expires_at: Date | null;
  sent_at: Date | null;
  accepted_name: string | null;
  accepted_at: Date | null;
  accepted_via: 'link' | 'phone' | null;
  express_request: number | boolean | null;
  signature_key: string | null;
  declined_at: Date | null;
  decline_reason: string | null;
  created_at: Date;
}

export async function insertQuote(trx: Knex.Transaction, row: Record<string, unknown>): Promise<number> {
  const [id] = await trx('quotes').insert(row);
  return id as number;
}

export async function findQuote(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<QuoteRow | undefined> {
  const q = db('quotes').where({ firm_id: firmId, id }).first();
  return (await (opts.forUpdate ? q.forUpdate() : q)) as QuoteRow | undefined;
}

/** The quote a customer's link opens: any firm, by the token's hash (the caller checks its expiry). */
export async function findQuoteByTokenHash(
  db: Db,
  tokenHash: string,
  opts: { forUpdate?: boolean } = {},
): Promise<QuoteRow | undefined> {
  const q = db('quotes').where({ token_hash: tokenHash }).first();
  return (await (opts.forUpdate ? q.forUpdate() : q)) as QuoteRow | undefined;
}

export async function listQuotes(db: Db, firmId: number, filter: { jobId?: number } = {}): Promise<QuoteRow[]> {
  const q = db('quotes').where({ firm_id: firmId });
  if (filter.jobId) q.andWhere({ job_id: filter.jobId });
  return (await q.orderBy('id', 'desc').limit(500)) as QuoteRow[];
}

export async function findAcceptedQuoteForJob(db: Db, firmId: number, jobId: number): Promise<QuoteRow | undefined> {
  return (await db('quotes')
    .where({ firm_id: firmId, job_id: jobId, status: 'accepted' })
    .orderBy('accepted_at', 'desc')
    .first()) as QuoteRow | undefined;
}

export async function updateQuote(
  trx: Knex.Transaction,
  firmId: number,
  id: number,
  fields: Record<string, unknown>,
): Promise<void> {
  await trx('quotes').where({ firm_id: firmId, id }).update(fields);
}
