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
  min_shelf_life_days: number;
  supplier_code: string | null;
  cost_price_pence: number | null;
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

/** Every product's name, pack size, supplier code and cost price (the restock run and reorder list). */
export async function listProductOrderRefs(db: Db, firmId: number) {
  return (await db('products')
    .where({ firm_id: firmId })
    .select(
      'id',
      'name',
      'pack_size_ml as packSizeMl',
      'supplier_code as supplierCode',
      'cost_price_pence as costPricePence',
    )) as {
    id: number;
    name: string;
    packSizeMl: number;
    supplierCode: string | null;
    costPricePence: number | null;
  }[];
}

/** The minimum remaining life of some products, for the receiving check. */
export async function listMinShelfLifeDays(db: Db, firmId: number, productIds: number[]) {
  if (productIds.length === 0) return new Map<number, number>();
  const rows = (await db('products')
    .where('firm_id', firmId)
    .whereIn('id', productIds)
    .select('id', 'min_shelf_life_days')) as { id: number; min_shelf_life_days: number }[];
  return new Map(rows.map((r) => [r.id, r.min_shelf_life_days]));
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
