import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

/** Packs of each product a completed job took off the van (the 'used' ledger rows, less any reversal). */
export async function packsUsedByProduct(
  db: Db,
  firmId: number,
  jobId: number,
): Promise<{ productId: number; name: string; packs: number }[]> {
  const rows = (await db('stock_movements as m')
    .join('products as p', (j) => j.on('p.id', '=', 'm.product_id').andOn('p.firm_id', '=', 'm.firm_id'))
    .where({ 'm.firm_id': firmId, 'm.job_id': jobId, 'm.kind': 'used' })
    .groupBy('m.product_id', 'p.name')
    .select('m.product_id', 'p.name', db.raw('-SUM(m.quantity_delta) AS packs'))) as {
    product_id: number;
    name: string;
    packs: number | string;
  }[];
  return rows
    .map((r) => ({ productId: Number(r.product_id), name: r.name, packs: Number(r.packs) }))
    .filter((r) => r.packs > 0);
}

/** The firm, customer and site as an invoice or quote prints them. */
export interface PartiesRow {
  firmName: string;
  firmAddress: string | null;
  firmPhone: string | null;
  firmEmail: string | null;
  timeZone: string;
  customerId: number;
  customerName: string;
  customerEmail: string | null;
  siteAddress: string;
  sitePostcode: string | null;
}

export async function findJobParties(db: Db, firmId: number, jobId: number): Promise<PartiesRow | undefined> {
  const r = (await db('jobs as j')
    .join('firms as f', 'f.id', 'j.firm_id')
    .join('sites as s', (q) => q.on('s.id', '=', 'j.site_id').andOn('s.firm_id', '=', 'j.firm_id'))
    .join('customers as c', (q) => q.on('c.id', '=', 's.customer_id').andOn('c.firm_id', '=', 's.firm_id'))
    .where({ 'j.firm_id': firmId, 'j.id': jobId })
    .first(
      'f.name as firm_name',
      'f.address as firm_address',
      'f.phone as firm_phone',
      'f.email as firm_email',
      'f.time_zone',
      'c.id as customer_id',
      'c.name as customer_name',
      'c.email as customer_email',
      's.address as site_address',
      's.postcode as site_postcode',
    )) as Record<string, unknown> | undefined;
  if (!r) return undefined;
  return {
    firmName: String(r.firm_name),
    firmAddress: (r.firm_address as string | null) ?? null,
    firmPhone: (r.firm_phone as string | null) ?? null,
    firmEmail: (r.firm_email as string | null) ?? null,
    timeZone: String(r.time_zone),
    customerId: Number(r.customer_id),
    customerName: String(r.customer_name),
    customerEmail: (r.customer_email as string | null) ?? null,
    siteAddress: String(r.site_address),
    sitePostcode: (r.site_postcode as string | null) ?? null,
  };
}

export async function findFirmForMoney(db: Db, firmId: number) {
  return (await db('firms').where({ id: firmId }).first('name', 'address', 'phone', 'email', 'time_zone')) as
    { name: string; address: string | null; phone: string | null; email: string | null; time_zone: string } | undefined;
}
