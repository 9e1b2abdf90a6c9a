import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface SiteRecord {
  id: number;
  address: string;
  postcode: string | null;
  accessNotes: string | null;
  systemNotes: string | null;
  nextCheckOn: string | null;
  customer: { id: number; name: string; email: string | null; phone: string | null; contact: string | null };
}

export async function findSite(db: Db, firmId: number, siteId: number, forUpdate = false): Promise<SiteRecord | undefined> {
  const q = db('sites as s')
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': firmId, 's.id': siteId })
    .first('s.id', 's.address', 's.postcode', 's.access_notes', 's.system_notes', 's.next_check_on', 'c.id as customer_id', 'c.name as customer_name', 'c.email', 'c.phone', 'c.contact');
  if (forUpdate) q.forUpdate();
  const r = (await q) as Record<string, unknown> | undefined;
  if (!r) return undefined;
  return {
    id: r.id as number,
    address: r.address as string,
    postcode: (r.postcode as string | null) ?? null,
    accessNotes: (r.access_notes as string | null) ?? null,
    systemNotes: (r.system_notes as string | null) ?? null,
    nextCheckOn: (r.next_check_on as string | null) ?? null,
    customer: { id: r.customer_id as number, name: r.customer_name as string, email: (r.email as string | null) ?? null, phone: (r.phone as string | null) ?? null, contact: (r.contact as string | null) ?? null },
  };
}

export async function listSiteJobs(db: Db, firmId: number, siteId: number) {
  const rows = (await db('jobs as j')
    .leftJoin('memberships as m', (jn) => jn.on('m.id', '=', 'j.engineer_member_id').andOn('m.firm_id', '=', 'j.firm_id'))
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where({ 'j.firm_id': firmId, 'j.site_id': siteId })
    .orderBy([{ column: 'j.scheduled_on', order: 'desc' }, { column: 'j.id', order: 'desc' }])
    .select('j.id', 'j.status', 'j.scheduled_on', 'j.completed_at', 'j.next_check_on', 'u.name as engineer_name')) as {
    id: number; status: 'planned' | 'completed'; scheduled_on: string; completed_at: Date | null; next_check_on: string | null; engineer_name: string | null;
  }[];
  return rows.map((r) => ({
    id: r.id, status: r.status, scheduledOn: r.scheduled_on, completedAt: r.completed_at ? new Date(r.completed_at).toISOString() : null, nextCheckOn: r.next_check_on, engineerName: r.engineer_name,
  }));
}

export async function listSiteChecks(db: Db, firmId: number, siteId: number) {
  const rows = (await db('site_checks as k')
    .join('products as p', (j) => j.on('p.id', '=', 'k.product_id').andOn('p.firm_id', '=', 'k.firm_id'))
    .join('users as u', 'u.id', 'k.by_user_id')
    .where({ 'k.firm_id': firmId, 'k.site_id': siteId })
    .orderBy([{ column: 'k.checked_on', order: 'desc' }, { column: 'k.id', order: 'desc' }])
    .select('k.*', 'p.name as product_name', 'u.name as by_name')) as Record<string, unknown>[];
  return rows.map((r) => ({
    id: r.id as number,
    checkedOn: r.checked_on as string,
    product: { id: r.product_id as number, name: r.product_name as string },
    inhibitorReading: Number(r.reading),
    target: { min: Number(r.target_min), max: Number(r.target_max), unit: (r.target_unit as string | null) ?? null },
    systemTdsPpm: r.tds_ppm === null ? null : Number(r.tds_ppm),
    result: r.result as 'pass' | 'fail',
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
  return db('products').where({ firm_id: firmId, id: productId }).first('id', 'name', 'kind', 'target_min', 'target_max', 'target_unit', 'test_method') as Promise<InhibitorRow | undefined>;
}

/** The firm's active inhibitors that have a target range: the ones a check can be recorded against. */
export async function listCheckableInhibitors(db: Db, firmId: number) {
  const rows = (await db('products')
    .where({ firm_id: firmId, kind: 'inhibitor', active: true })
    .whereNotNull('target_min')
    .whereNotNull('target_max')
    .orderBy('name')
    .select('id', 'name', 'kind', 'target_min', 'target_max', 'target_unit', 'test_method')) as InhibitorRow[];
  return rows.map((r) => ({ id: r.id, name: r.name, targetMin: Number(r.target_min), targetMax: Number(r.target_max), targetUnit: r.target_unit, testMethod: r.test_method }));
}

export async function insertSiteCheck(
  trx: Knex.Transaction,
  row: { firmId: number; siteId: number; checkedOn: string; productId: number; reading: number; min: number; max: number; unit: string | null; tdsPpm: number | null; result: 'pass' | 'fail'; notes: string | null; byUserId: number },
): Promise<number> {
  const [id] = await trx('site_checks').insert({
    firm_id: row.firmId, site_id: row.siteId, checked_on: row.checkedOn, product_id: row.productId, reading: row.reading, target_min: row.min, target_max: row.max, target_unit: row.unit,
    tds_ppm: row.tdsPpm, result: row.result, notes: row.notes, by_user_id: row.byUserId,
  });
  return id as number;
}

export async function setSiteNextCheck(trx: Knex.Transaction, firmId: number, siteId: number, nextCheckOn: string): Promise<void> {
  await trx('sites').where({ firm_id: firmId, id: siteId }).update({ next_check_on: nextCheckOn });
}

/** Every site of the firm with its customer, by customer then address (a firm has a few thousand at most). */
export async function listSites(db: Db, firmId: number) {
  const rows = (await db('sites as s')
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', firmId)
    .orderBy([{ column: 'c.name' }, { column: 's.address' }])
    .select('s.id', 's.address', 's.postcode', 's.next_check_on', 'c.id as customer_id', 'c.name as customer_name')) as {
    id: number; address: string; postcode: string | null; next_check_on: string | null; customer_id: number; customer_name: string;
  }[];
  return rows.map((r) => ({ id: r.id, address: r.address, postcode: r.postcode, nextCheckOn: r.next_check_on, customer: { id: r.customer_id, name: r.customer_name } }));
}
