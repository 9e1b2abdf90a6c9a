import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface BookedJobRow {
  id: number;
  van_location_id: number;
  scheduled_on: string;
  visit_kind: 'full_clean' | 'inhibitor_only';
  survey: unknown;
  site_address: string;
  engineer_member_id: number | null;
}

/** Booked (planned) jobs with a van (or on one van) on the days [from, toExclusive), soonest first. */
export async function listBookedJobRows(
  db: Db,
  firmId: number,
  from: string,
  toExclusive: string,
  vanId?: number,
): Promise<BookedJobRow[]> {
  const q = db('jobs as j');
  if (vanId !== undefined) q.where('j.van_location_id', vanId);
  return (await q
    .join('sites as s', (on) => on.on('s.id', '=', 'j.site_id').andOn('s.firm_id', '=', 'j.firm_id'))
    .where({ 'j.firm_id': firmId, 'j.status': 'planned' })
    .whereNotNull('j.van_location_id')
    .where('j.scheduled_on', '>=', from)
    .where('j.scheduled_on', '<', toExclusive)
    .orderBy([{ column: 'j.scheduled_on' }, { column: 'j.id' }])
    .select(
      'j.id',
      'j.van_location_id',
      'j.scheduled_on',
      'j.visit_kind',
      'j.survey',
      's.address as site_address',
      'j.engineer_member_id',
    )) as BookedJobRow[];
}

/** The products chosen for some jobs, with their dose rules. */
export async function listJobProductRules(db: Db, firmId: number, jobIds: number[]) {
  if (jobIds.length === 0) return [];
  return (await db('job_products as jp')
    .join('products as p', (on) => on.on('p.id', '=', 'jp.product_id').andOn('p.firm_id', '=', 'jp.firm_id'))
    .where('jp.firm_id', firmId)
    .whereIn('jp.job_id', jobIds)
    .select(
      'jp.job_id',
      'p.id as product_id',
      'p.kind',
      'p.pack_size_ml',
      'p.dose_litres_per_100l',
      'p.radiators_per_pack',
    )) as {
    job_id: number;
    product_id: number;
    kind: string;
    pack_size_ml: number;
    dose_litres_per_100l: string | null;
    radiators_per_pack: number | null;
  }[];
}

/** The firm's restock window in days (the setting, 7 unless changed). */
export async function findRestockDays(db: Db, firmId: number): Promise<number | null> {
  const row = (await db('firms').where({ id: firmId }).first('restock_days')) as { restock_days: number } | undefined;
  return row ? Number(row.restock_days) : null;
}
