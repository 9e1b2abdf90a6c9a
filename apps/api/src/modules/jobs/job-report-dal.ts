import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

// The reports' own queries: what a report prints beyond the job sheet's answer.

export interface ReportFirmRow {
  name: string;
  address: string | null;
  phone: string | null;
  email: string | null;
  registration_numbers: string | null;
  time_zone: string;
}

/** The firm as its reports print it: name, contact details and registrations, and its time zone. */
export async function findReportFirm(db: Db, firmId: number): Promise<ReportFirmRow | undefined> {
  return (await db('firms')
    .where({ id: firmId })
    .first('name', 'address', 'phone', 'email', 'registration_numbers', 'time_zone')) as ReportFirmRow | undefined;
}

export interface ReportChemicalRow {
  product: string;
  kind: string;
  pack_size_ml: number;
  lot_number: string;
  expires_on: string;
  packs: number | string;
}

/** The chemicals a completed job took off the van, by batch, with the product's pack size. */
export async function listReportChemicals(db: Db, firmId: number, jobId: number): Promise<ReportChemicalRow[]> {
  return (await db('stock_movements as m')
    .join('product_batches as b', (j) => j.on('b.id', '=', 'm.batch_id').andOn('b.firm_id', '=', 'm.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 'm.product_id').andOn('p.firm_id', '=', 'm.firm_id'))
    .where({ 'm.firm_id': firmId, 'm.job_id': jobId, 'm.kind': 'used' })
    .orderBy([{ column: 'p.kind' }, { column: 'p.name' }, { column: 'b.expires_on' }])
    .select(
      'p.name as product',
      'p.kind',
      'p.pack_size_ml',
      'b.lot_number',
      'b.expires_on',
      db.raw('-m.quantity_delta AS packs'),
    )) as ReportChemicalRow[];
}

/** How the inhibitor is tested (the product's own words, e.g. a test kit or a refractometer). */
export async function findTestMethod(db: Db, firmId: number, productId: number): Promise<string | null> {
  const row = (await db('products').where({ firm_id: firmId, id: productId }).first('test_method')) as
    { test_method: string | null } | undefined;
  return row?.test_method ?? null;
}

/** Where each of a job's drawn signatures is stored (the sheet's answer has the name and time). */
export async function listSignatureObjects(db: Db, firmId: number, jobId: number) {
  return (await db('job_signatures').where({ firm_id: firmId, job_id: jobId }).select('kind', 'object_key')) as {
    kind: string;
    object_key: string;
  }[];
}
