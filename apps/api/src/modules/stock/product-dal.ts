import type { Knex } from 'knex';
import type { Product } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;
type Trx = Knex.Transaction;

export interface ProductRow {
  id: number;
  name: string;
  kind: Product['kind'];
  own_kind: string | null;
  pack_size_ml: number;
  dose_litres_per_100l: string | null;
  radiators_per_pack: number | null;
  target_min: string | null;
  target_max: string | null;
  target_unit: string | null;
  test_method: string | null;
  shelf_life_months: number | null;
  hazard_notes: string | null;
  min_circulation_minutes: number | null;
  sds_object_key: string | null;
  sds_byte_size: number | null;
  sds_uploaded_at: Date | null;
  active: number;
}

export type ProductWrite = Partial<
  Omit<
    ProductRow,
    | 'id'
    | 'sds_object_key'
    | 'sds_byte_size'
    | 'sds_uploaded_at'
    | 'active'
    | 'dose_litres_per_100l'
    | 'target_min'
    | 'target_max'
  >
> & {
  dose_litres_per_100l?: number | null;
  target_min?: number | null;
  target_max?: number | null;
};

export interface BatchRow {
  id: number;
  product_id: number;
  lot_number: string;
  expires_on: string;
}

export async function listProductRows(db: Db, firmId: number): Promise<ProductRow[]> {
  return db('products').where({ firm_id: firmId }).orderBy('name');
}

export async function findProductRow(db: Db, firmId: number, id: number): Promise<ProductRow | undefined> {
  return db('products').where({ firm_id: firmId, id }).first();
}

/** A product's id and name; forUpdate locks its row while it is changed. */
export async function findProductRef(
  db: Db,
  firmId: number,
  id: number,
  opts: { forUpdate?: boolean } = {},
): Promise<{ id: number; name: string } | undefined> {
  const q = db('products').where({ firm_id: firmId, id }).first('id', 'name');
  if (opts.forUpdate) q.forUpdate();
  return q;
}

export async function productNameTaken(db: Db, firmId: number, name: string): Promise<boolean> {
  return Boolean(await db('products').where({ firm_id: firmId, name }).first('id'));
}

export async function insertProduct(trx: Trx, firmId: number, row: ProductWrite): Promise<number> {
  const [id] = await trx('products').insert({ firm_id: firmId, ...row });
  return id as number;
}

export async function updateProductRow(
  db: Db,
  firmId: number,
  id: number,
  row: ProductWrite | Pick<ProductRow, 'sds_object_key' | 'sds_byte_size' | 'sds_uploaded_at'>,
): Promise<void> {
  await db('products').where({ firm_id: firmId, id }).update(row);
}

export async function listProductNames(db: Db, firmId: number): Promise<{ id: number; name: string }[]> {
  return db('products').where({ firm_id: firmId }).select('id', 'name');
}

/** Active products for the stock grid, by name. */
export async function listActiveProductSummaries(db: Db, firmId: number) {
  return (await db('products')
    .where({ firm_id: firmId, active: true })
    .orderBy('name')
    .select('id', 'name', 'kind', 'pack_size_ml as packSizeMl')) as {
    id: number;
    name: string;
    kind: Product['kind'];
    packSizeMl: number;
  }[];
}

export async function findBatch(db: Db, firmId: number, id: number, productId?: number): Promise<BatchRow | undefined> {
  const q = db('product_batches').where({ firm_id: firmId, id }).first('id', 'product_id', 'lot_number', 'expires_on');
  if (productId !== undefined) q.where('product_id', productId);
  return q;
}

export async function findBatchByLot(
  db: Db,
  firmId: number,
  productId: number,
  lotNumber: string,
): Promise<{ id: number; expires_on: string } | undefined> {
  return db('product_batches')
    .where({ firm_id: firmId, product_id: productId, lot_number: lotNumber })
    .first('id', 'expires_on');
}

export async function insertBatch(
  trx: Trx,
  firmId: number,
  batch: { productId: number; lotNumber: string; expiresOn: string },
): Promise<number> {
  const [id] = await trx('product_batches').insert({
    firm_id: firmId,
    product_id: batch.productId,
    lot_number: batch.lotNumber,
    expires_on: batch.expiresOn,
  });
  return id as number;
}

export async function listBatchExpiries(db: Db, firmId: number): Promise<{ id: number; expires_on: string }[]> {
  return db('product_batches').where('firm_id', firmId).select('id', 'expires_on');
}
