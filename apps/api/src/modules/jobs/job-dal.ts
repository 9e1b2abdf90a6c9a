import type { Knex } from 'knex';
import type { JobListRow, Survey } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface JobRow {
  id: number;
  site_id: number;
  engineer_member_id: number | null;
  van_location_id: number | null;
  scheduled_on: string;
  status: 'planned' | 'completed';
  survey: string | Survey;
  completed_at: Date | null;
  next_check_on: string | null;
  notes: string | null;
}

export async function findJobRow(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<JobRow | undefined> {
  const q = db('jobs').where({ firm_id: firmId, id }).first();
  if (opts.forUpdate) q.forUpdate();
  return (await q) as JobRow | undefined;
}

/** The firm's jobs, latest date first (the newest 500). */
export async function listJobRows(db: Db, firmId: number): Promise<JobListRow[]> {
  return (await db('jobs as j')
    .join('sites as s', (j) => j.on('s.id', '=', 'j.site_id').andOn('s.firm_id', '=', 'j.firm_id'))
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where('j.firm_id', firmId)
    .orderBy('j.scheduled_on', 'desc')
    .limit(500)
    .select(
      'j.id',
      'j.status',
      'j.scheduled_on as scheduledOn',
      's.address',
      'c.name as customerName',
      'j.next_check_on as nextCheckOn',
    )) as JobListRow[];
}

export async function insertJob(
  db: Db,
  row: {
    firmId: number;
    siteId: number;
    engineerMemberId: number | null;
    vanLocationId: number | null;
    scheduledOn: string;
    survey: Survey;
  },
): Promise<number> {
  const [id] = await db('jobs').insert({
    firm_id: row.firmId,
    site_id: row.siteId,
    engineer_member_id: row.engineerMemberId,
    van_location_id: row.vanLocationId,
    scheduled_on: row.scheduledOn,
    survey: JSON.stringify(row.survey),
  });
  return id as number;
}

export async function insertJobProducts(db: Db, firmId: number, jobId: number, productIds: number[]): Promise<void> {
  if (productIds.length)
    await db('job_products').insert(
      productIds.map((productId) => ({ firm_id: firmId, job_id: jobId, product_id: productId })),
    );
}

/** Which of these product ids the firm has. */
export async function findFirmProductIds(db: Db, firmId: number, productIds: number[]): Promise<number[]> {
  if (productIds.length === 0) return [];
  const rows = (await db('products').where({ firm_id: firmId }).whereIn('id', productIds).select('id')) as {
    id: number;
  }[];
  return rows.map((r) => r.id);
}

export interface DoseProductRow {
  id: number;
  name: string;
  kind: string;
  pack_size_ml: number;
  dose_litres_per_100l: string | null;
  radiators_per_pack: number | null;
}

/** The products a job doses, with their dose rules. */
export async function listJobDoseProducts(db: Db, firmId: number, jobId: number): Promise<DoseProductRow[]> {
  return (await db('job_products as jp')
    .join('products as p', (j) => j.on('p.id', '=', 'jp.product_id').andOn('p.firm_id', '=', 'jp.firm_id'))
    .where({ 'jp.firm_id': firmId, 'jp.job_id': jobId })
    .orderBy('p.kind')
    .select(
      'p.id',
      'p.name',
      'p.kind',
      'p.pack_size_ml',
      'p.dose_litres_per_100l',
      'p.radiators_per_pack',
    )) as DoseProductRow[];
}

/** The chemicals a completed job took off the van, by batch. */
export async function listChemicalsUsed(db: Db, firmId: number, jobId: number) {
  return (await db('stock_movements as m')
    .join('product_batches as b', 'b.id', 'm.batch_id')
    .join('products as p', 'p.id', 'm.product_id')
    .where({ 'm.firm_id': firmId, 'm.job_id': jobId, 'm.kind': 'used' })
    .select(
      'p.name as product',
      'b.lot_number as lotNumber',
      'b.expires_on as expiresOn',
      db.raw('-m.quantity_delta AS packs'),
    )) as {
    product: string;
    lotNumber: string;
    expiresOn: string;
    packs: number;
  }[];
}

export async function markJobCompleted(
  trx: Knex.Transaction,
  firmId: number,
  jobId: number,
  done: { at: Date; byUserId: number; nextCheckOn: string },
): Promise<void> {
  await trx('jobs')
    .where({ firm_id: firmId, id: jobId })
    .update({
      status: 'completed',
      completed_at: done.at,
      completed_by_user_id: done.byUserId,
      next_check_on: done.nextCheckOn,
    });
}

export async function updateJobNotes(db: Db, firmId: number, jobId: number, notes: string): Promise<void> {
  await db('jobs')
    .where({ firm_id: firmId, id: jobId })
    .update({ notes: notes === '' ? null : notes });
}
