import type { Knex } from 'knex';
import type { CustomerSite, SiteInput, SiteListRow } from '@heatfleet/domain';

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

export async function findSite(
  db: Db,
  firmId: number,
  siteId: number,
  forUpdate = false,
): Promise<SiteRecord | undefined> {
  const q = db('sites as s')
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': firmId, 's.id': siteId })
    .first(
      's.id',
      's.address',
      's.postcode',
      's.access_notes',
      's.system_notes',
      's.next_check_on',
      'c.id as customer_id',
      'c.name as customer_name',
      'c.email',
      'c.phone',
      'c.contact',
    );
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
    customer: {
      id: r.customer_id as number,
      name: r.customer_name as string,
      email: (r.email as string | null) ?? null,
      phone: (r.phone as string | null) ?? null,
      contact: (r.contact as string | null) ?? null,
    },
  };
}

export async function listSiteJobs(db: Db, firmId: number, siteId: number) {
  const rows = (await db('jobs as j')
    .leftJoin('memberships as m', (jn) =>
      jn.on('m.id', '=', 'j.engineer_member_id').andOn('m.firm_id', '=', 'j.firm_id'),
    )
    .leftJoin('users as u', 'u.id', 'm.user_id')
    .where({ 'j.firm_id': firmId, 'j.site_id': siteId })
    .orderBy([
      { column: 'j.scheduled_on', order: 'desc' },
      { column: 'j.id', order: 'desc' },
    ])
    .select('j.id', 'j.status', 'j.scheduled_on', 'j.completed_at', 'j.next_check_on', 'u.name as engineer_name')) as {
    id: number;
    status: 'planned' | 'completed';
    scheduled_on: string;
    completed_at: Date | null;
    next_check_on: string | null;
    engineer_name: string | null;
  }[];
  return rows.map((r) => ({
    id: r.id,
    status: r.status,
    scheduledOn: r.scheduled_on,
    completedAt: r.completed_at ? new Date(r.completed_at).toISOString() : null,
    nextCheckOn: r.next_check_on,
    engineerName: r.engineer_name,
  }));
}

export async function setSiteNextCheck(trx: Db, firmId: number, siteId: number, nextCheckOn: string): Promise<void> {
  await trx('sites').where({ firm_id: firmId, id: siteId }).update({ next_check_on: nextCheckOn });
}

/** Every site of the firm with its customer, by customer then address (a firm has a few thousand at most). */
export async function listSites(db: Db, firmId: number): Promise<SiteListRow[]> {
  const rows = (await db('sites as s')
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', firmId)
    .orderBy([{ column: 'c.name' }, { column: 's.address' }])
    .select(
      's.id',
      's.address',
      's.postcode',
      's.next_check_on',
      'c.id as customer_id',
      'c.name as customer_name',
    )) as {
    id: number;
    address: string;
    postcode: string | null;
    next_check_on: string | null;
    customer_id: number;
    customer_name: string;
  }[];
  return rows.map((r) => ({
    id: r.id,
    address: r.address,
    postcode: r.postcode,
    nextCheckOn: r.next_check_on,
    customer: { id: r.customer_id, name: r.customer_name },
  }));
}

/** A customer's sites, in the order they were added. */
export async function listSitesOfCustomer(db: Db, firmId: number, customerId: number): Promise<CustomerSite[]> {
  return (await db('sites')
    .where({ firm_id: firmId, customer_id: customerId })
    .orderBy('id')
    .select(
      'id',
      'address',
      'postcode',
      'access_notes as accessNotes',
      'system_notes as systemNotes',
      'next_check_on as nextCheckOn',
    )) as CustomerSite[];
}

export async function insertSite(db: Db, firmId: number, customerId: number, input: SiteInput): Promise<number> {
  const [id] = await db('sites').insert({
    firm_id: firmId,
    customer_id: customerId,
    address: input.address,
    postcode: input.postcode ?? null,
    access_notes: input.accessNotes ?? null,
    system_notes: input.systemNotes ?? null,
  });
  return id as number;
}

export async function siteExists(db: Db, firmId: number, siteId: number): Promise<boolean> {
  return Boolean(await db('sites').where({ firm_id: firmId, id: siteId }).first('id'));
}

/** A job's site with its customer's name, as the job shows it. */
export async function findJobSite(db: Db, firmId: number, siteId: number) {
  return (await db('sites as s')
    .join('customers as c', (j) => j.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': firmId, 's.id': siteId })
    .first('s.id', 's.address', 's.postcode', 'c.id as customerId', 'c.name as customerName')) as
    { id: number; address: string; postcode: string | null; customerId: number; customerName: string } | undefined;
}

/** The rooms of the site's radiators in the order they are flushed, as the engineer last set it; null if never set. */
export async function findSiteFlushOrder(db: Db, firmId: number, siteId: number): Promise<string[] | null> {
  const row = (await db('sites').where({ firm_id: firmId, id: siteId }).first('flush_order')) as
    { flush_order: string | string[] | null } | undefined;
  const v = row?.flush_order ?? null;
  if (v === null) return null;
  const parsed: unknown = typeof v === 'string' ? JSON.parse(v) : v;
  return Array.isArray(parsed) ? parsed.filter((r): r is string => typeof r === 'string') : null;
}

export async function setSiteFlushOrder(db: Db, firmId: number, siteId: number, rooms: string[]): Promise<void> {
  await db('sites')
    .where({ firm_id: firmId, id: siteId })
    .update({ flush_order: JSON.stringify(rooms) });
}
