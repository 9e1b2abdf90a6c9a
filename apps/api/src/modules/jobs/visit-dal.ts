import type { Knex } from 'knex';
import type { CompletionCode, SignatureKind } from '@heatfleet/domain';

// The visit's own records (issue 12): signatures, completion reasons, cancellation, the names shown.

type Db = Knex | Knex.Transaction;

export interface SignatureRow {
  kind: SignatureKind;
  signer_name: string;
  object_key: string;
  byte_size: number;
  signed_at: Date;
}

export async function listSignatures(db: Db, firmId: number, jobId: number): Promise<SignatureRow[]> {
  return (
    (await db('job_signatures')
      .where({ firm_id: firmId, job_id: jobId })
      .orderBy('signed_at')
      // The engineer's time (the tap) where the phone said it, else when it arrived.
      .select(
        'kind',
        'signer_name',
        'object_key',
        'byte_size',
        db.raw('coalesce(tapped_at, signed_at) as signed_at'),
      )) as SignatureRow[]
  );
}

export async function findSignature(
  db: Db,
  firmId: number,
  jobId: number,
  kind: SignatureKind,
): Promise<SignatureRow | undefined> {
  return (await db('job_signatures')
    .where({ firm_id: firmId, job_id: jobId, kind })
    .first('kind', 'signer_name', 'object_key', 'byte_size', 'signed_at')) as SignatureRow | undefined;
}

/** Signing the same kind again replaces the earlier signature (its object is removed by the caller). */
export async function upsertSignature(
  trx: Knex.Transaction,
  row: {
    firm_id: number;
    job_id: number;
    kind: SignatureKind;
    signer_name: string;
    object_key: string;
    byte_size: number;
    signed_at: Date;
    tapped_at: Date | null;
    recorded_by_user_id: number;
  },
): Promise<void> {
  await trx('job_signatures')
    .insert(row)
    .onConflict(['firm_id', 'job_id', 'kind'])
    .merge(['signer_name', 'object_key', 'byte_size', 'signed_at', 'tapped_at', 'recorded_by_user_id']);
}

export interface CompletionReasonRow {
  code: CompletionCode;
  found: string;
  reason: string;
}

export async function listCompletionReasons(db: Db, firmId: number, jobId: number): Promise<CompletionReasonRow[]> {
  return (await db('job_completion_reasons')
    .where({ firm_id: firmId, job_id: jobId })
    .orderBy('id')
    .select('code', 'found', 'reason')) as CompletionReasonRow[];
}

export async function insertCompletionReasons(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  rows: CompletionReasonRow[],
): Promise<void> {
  if (rows.length)
    await trx('job_completion_reasons').insert(rows.map((r) => ({ firm_id: firmId, job_id: jobId, ...r })));
}

export async function markJobCancelled(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  done: { at: Date; byUserId: number; reason: string },
): Promise<void> {
  await trx('jobs').where({ firm_id: firmId, id: jobId, status: 'planned' }).update({
    status: 'cancelled',
    cancelled_at: done.at,
    cancelled_by_user_id: done.byUserId,
    cancellation_reason: done.reason,
  });
}

export async function updateJobFields(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  fields: {
    scheduled_on?: string;
    scheduled_time?: string | null;
    engineer_member_id?: number | null;
    van_location_id?: number | null;
    survey?: string;
    survey_version?: number;
    visit_kind?: string;
    system_details?: string;
  },
): Promise<void> {
  if (Object.keys(fields).length) await trx('jobs').where({ firm_id: firmId, id: jobId }).update(fields);
}

export async function replaceJobProducts(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  productIds: number[],
): Promise<void> {
  await trx('job_products').where({ firm_id: firmId, job_id: jobId }).delete();
  if (productIds.length)
    await trx('job_products').insert(productIds.map((p) => ({ firm_id: firmId, job_id: jobId, product_id: p })));
}

/** The highest radiator index anything on the sheet was recorded against (-1 when nothing was). */
export async function highestRecordedRadiator(db: Db, firmId: number, jobId: number): Promise<number> {
  const of = { firm_id: firmId, job_id: jobId };
  const rows = (await db.union(
    [
      db('job_radiator_readings').where(of).max('radiator_index as i'),
      db('job_agitations').where(of).max('radiator_index as i'),
      db('job_radiator_flushes').where(of).max('radiator_index as i'),
    ],
    true,
  )) as { i: number | null }[];
  return Math.max(-1, ...rows.map((r) => (r.i === null ? -1 : Number(r.i))));
}

/** The next report number of the firm, taken under the firm row's lock (no gaps, no repeats). */
export async function takeReportNumber(trx: Knex.Transaction, firmId: number): Promise<number> {
  await trx('firms').where({ id: firmId }).increment('last_report_number', 1);
  const row = (await trx('firms').where({ id: firmId }).first('last_report_number')) as { last_report_number: number };
  return Number(row.last_report_number);
}

export async function setJobReportNumber(trx: Knex.Transaction, firmId: number, jobId: number, n: number) {
  await trx('jobs').where({ firm_id: firmId, id: jobId }).update({ report_number: n });
}

export async function userName(db: Db, userId: number | null): Promise<string | null> {
  if (userId === null) return null;
  const row = (await db('users').where({ id: userId }).first('name')) as { name: string } | undefined;
  return row?.name ?? null;
}
