import type { Knex } from 'knex';
import type { JobListQuery, JobListRow, Survey, SystemDetails, VisitKind } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface JobRow {
  id: number;
  site_id: number;
  engineer_member_id: number | null;
  van_location_id: number | null;
  scheduled_on: string;
  scheduled_time: string | null;
  status: 'planned' | 'completed' | 'cancelled';
  visit_kind: VisitKind;
  survey: string | Survey;
  system_details: string | SystemDetails | null;
  completed_at: Date | null;
  next_check_on: string | null;
  notes: string | null;
  report_number: number | null;
  cancelled_at: Date | null;
  cancelled_by_user_id: number | null;
  cancellation_reason: string | null;
  recommendation: string | null;
  created_at: Date;
  completed_tapped_at: Date | null;
  notes_version: number;
  survey_version: number;
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

/**
 * The firm's jobs (at most 500), filtered by status, engineer and date. Newest date first, or with
 * `upcoming` the planned ones soonest first, then the rest newest first.
 */
export async function listJobRows(db: Db, firmId: number, filter: JobListQuery = {}): Promise<JobListRow[]> {
  const q = db('jobs as j')
    .join('sites as s', (j) => j.on('s.id', '=', 'j.site_id').andOn('s.firm_id', '=', 'j.firm_id'))
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .leftJoin('memberships as m', (j) => j.on('m.id', '=', 'j.engineer_member_id').andOn('m.firm_id', '=', 'j.firm_id'))
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where('j.firm_id', firmId)
    .limit(500)
    .select(
      'j.id',
      'j.status',
      'j.scheduled_on as scheduledOn',
      'j.scheduled_time as scheduledTime',
      's.address',
      's.postcode',
      'c.name as customerName',
      'j.next_check_on as nextCheckOn',
      'j.engineer_member_id as engineerMemberId',
      'u.name as engineerName',
      'j.visit_kind as visitKind',
      db.raw("JSON_UNQUOTE(JSON_EXTRACT(j.survey, '$.systemType')) AS systemType"),
      db.raw("COALESCE(JSON_LENGTH(j.survey, '$.radiators'), 0) AS radiatorCount"),
    );
  if (filter.status) q.where('j.status', filter.status);
  if (filter.engineerMemberId !== undefined) q.where('j.engineer_member_id', filter.engineerMemberId);
  if (filter.from) q.where('j.scheduled_on', '>=', filter.from);
  if (filter.to) q.where('j.scheduled_on', '<=', filter.to);
  if (filter.sort === 'upcoming') {
    q.orderByRaw(
      "j.status = 'planned' DESC, CASE WHEN j.status = 'planned' THEN j.scheduled_on END ASC, CASE WHEN j.status = 'planned' THEN j.scheduled_time IS NULL END ASC, CASE WHEN j.status = 'planned' THEN j.scheduled_time END ASC",
    )
      .orderBy('j.scheduled_on', 'desc')
      .orderBy('j.id', 'desc');
  } else {
    q.orderBy('j.scheduled_on', 'desc').orderBy('j.id', 'desc');
  }
  const rows = (await q) as (Omit<JobListRow, 'radiatorCount'> & { radiatorCount: number | string })[];
  return rows.map((r) => ({ ...r, radiatorCount: Number(r.radiatorCount) }));
}

export async function insertJob(
  db: Db,
  row: {
    firmId: number;
    siteId: number;
    engineerMemberId: number | null;
    vanLocationId: number | null;
    scheduledOn: string;
    scheduledTime: string | null;
    survey: Survey;
    visitKind: VisitKind;
    systemDetails: SystemDetails | null;
  },
): Promise<number> {
  const [id] = await db('jobs').insert({
    firm_id: row.firmId,
    site_id: row.siteId,
    engineer_member_id: row.engineerMemberId,
    van_location_id: row.vanLocationId,
    scheduled_on: row.scheduledOn,
    scheduled_time: row.scheduledTime,
    survey: JSON.stringify(row.survey),
    visit_kind: row.visitKind,
    system_details: row.systemDetails === null ? null : JSON.stringify(row.systemDetails),
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
  done: { at: Date; tappedAt?: Date | null; byUserId: number; nextCheckOn: string; recommendation?: string | null },
): Promise<void> {
  await trx('jobs')
    .where({ firm_id: firmId, id: jobId })
    .update({
      status: 'completed',
      completed_at: done.at,
      completed_tapped_at: done.tappedAt ?? null,
      completed_by_user_id: done.byUserId,
      next_check_on: done.nextCheckOn,
      recommendation: done.recommendation ?? null,
    });
}

/** The notes, and their version one on (a write made on the earlier version is refused by the caller). */
export async function updateJobNotes(db: Db, firmId: number, jobId: number, notes: string): Promise<void> {
  await db('jobs')
    .where({ firm_id: firmId, id: jobId })
    .update({ notes: notes === '' ? null : notes, notes_version: db.raw('notes_version + 1') });
}
