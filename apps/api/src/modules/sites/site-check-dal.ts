import type { Knex } from 'knex';
import { inhibitorCheck, type CheckableInhibitor, type SiteCheck } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export async function listSiteChecks(db: Db, firmId: number, siteId: number): Promise<SiteCheck[]> {
  const rows = (await db('site_checks as k')
    .join('products as p', (j) => j.on('p.id', '=', 'k.product_id').andOn('p.firm_id', '=', 'k.firm_id'))
    .join('users as u', 'u.id', 'k.by_user_id')
    .leftJoin('locations as v', (j) => j.on('v.id', '=', 'k.top_up_location_id').andOn('v.firm_id', '=', 'k.firm_id'))
    .where({ 'k.firm_id': firmId, 'k.site_id': siteId })
    .orderBy([
      { column: 'k.checked_on', order: 'desc' },
      { column: 'k.id', order: 'desc' },
    ])
    .select('k.*', 'p.name as product_name', 'u.name as by_name', 'v.name as van_name')) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    checkedOn: r.checked_on as string,
    product: { id: r.product_id as number, name: r.product_name as string },
    inhibitorReading: Number(r.reading),
    target: { min: Number(r.target_min), max: Number(r.target_max), unit: (r.target_unit as string | null) ?? null },
    systemTdsPpm: r.tds_ppm === null ? null : Number(r.tds_ppm),
    result: r.result as 'pass' | 'fail',
    // The first reading against the range copied onto the row (the re-test, if any, decided `result`).
    firstResult:
      inhibitorCheck(Number(r.reading), { min: Number(r.target_min), max: Number(r.target_max) }) === 'pass'
        ? 'pass'
        : 'fail',
    retestReading: r.retest_reading === null ? null : Number(r.retest_reading),
    topUp:
      r.top_up_packs === null
        ? null
        : { packs: Number(r.top_up_packs), van: { id: r.top_up_location_id as number, name: r.van_name as string } },
    nextCheckOn: (r.next_check_on as string | null) ?? null,
    noteEmailed: r.note_email_id !== null,
    notes: (r.notes as string | null) ?? null,
    byName: r.by_name as string,
    createdAt: new Date(r.created_at as Date).toISOString(),
  }));
}

export interface InhibitorRow {
  id: number;
  name: string;
  kind: string;
  target_min: string | null;
  target_max: string | null;
  target_unit: string | null;
  test_method: string | null;
}

export function findProduct(db: Db, firmId: number, productId: number): Promise<InhibitorRow | undefined> {
  return db('products')
    .where({ firm_id: firmId, id: productId })
    .first('id', 'name', 'kind', 'target_min', 'target_max', 'target_unit', 'test_method') as Promise<
    InhibitorRow | undefined
  >;
}

/** The firm's active inhibitors that have a target range: the ones a check can be recorded against. */
export async function listCheckableInhibitors(db: Db, firmId: number): Promise<CheckableInhibitor[]> {
  const rows = (await db('products')
    .where({ firm_id: firmId, kind: 'inhibitor', active: true })
    .whereNotNull('target_min')
    .whereNotNull('target_max')
    .orderBy('name')
    .select('id', 'name', 'kind', 'target_min', 'target_max', 'target_unit', 'test_method')) as InhibitorRow[];
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    targetMin: Number(r.target_min),
    targetMax: Number(r.target_max),
    targetUnit: r.target_unit,
    testMethod: r.test_method,
  }));
}

export async function insertSiteCheck(
  trx: Knex.Transaction,
  row: {
    firmId: number;
    siteId: number;
    checkedOn: string;
    productId: number;
    reading: number;
    min: number;
    max: number;
    unit: string | null;
    tdsPpm: number | null;
    result: 'pass' | 'fail';
    notes: string | null;
    byUserId: number;
    retestReading: number | null;
    topUp: { packs: number; vanId: number; groupId: string } | null;
    nextCheckOn: string;
  },
): Promise<number> {
  const [id] = await trx('site_checks').insert({
    firm_id: row.firmId,
    site_id: row.siteId,
    checked_on: row.checkedOn,
    product_id: row.productId,
    reading: row.reading,
    target_min: row.min,
    target_max: row.max,
    target_unit: row.unit,
    tds_ppm: row.tdsPpm,
    result: row.result,
    notes: row.notes,
    by_user_id: row.byUserId,
    retest_reading: row.retestReading,
    top_up_packs: row.topUp?.packs ?? null,
    top_up_location_id: row.topUp?.vanId ?? null,
    top_up_group_id: row.topUp?.groupId ?? null,
    next_check_on: row.nextCheckOn,
  });
  return id as number;
}

export async function setSiteCheckNoteEmail(trx: Knex.Transaction, firmId: number, id: number, emailId: number) {
  await trx('site_checks').where({ firm_id: firmId, id }).update({ note_email_id: emailId });
}
