import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;
type Trx = Knex.Transaction;

export type MovementKind =
  'received' | 'transfer_out' | 'transfer_in' | 'used' | 'counted' | 'written_off' | 'reversal';

export interface MovementRow {
  id: number;
  group_id: string;
  kind: MovementKind;
  location_id: number;
  product_id: number;
  batch_id: number;
  quantity_delta: number;
}

export interface NewMovementRow {
  group_id: string;
  kind: MovementKind;
  location_id: number;
  product_id: number;
  batch_id: number;
  quantity_delta: number;
  reason: string | null;
  reference: string | null;
  reverses_movement_id: number | null;
  job_id: number | null;
  by_user_id: number;
  created_at: Date;
  /** When the engineer tapped (X-Tapped-At), if the request said. */
  tapped_at: Date | null;
}

/**
 * Lowers a balance by a negative delta only while it stays at or above zero (a conditional update),
 * so two requests racing for the last pack cannot both have it. Returns whether the balance changed.
 */
export async function decreaseBalance(
  trx: Trx,
  firmId: number,
  locationId: number,
  batchId: number,
  quantityDelta: number,
): Promise<boolean> {
  const changed = await trx('stock_balances')
    .where({ firm_id: firmId, location_id: locationId, batch_id: batchId })
    .andWhereRaw('quantity + ? >= 0', [quantityDelta])
    .update({ quantity: trx.raw('quantity + ?', [quantityDelta]) });
  return changed === 1;
}

export async function increaseBalance(
  trx: Trx,
  firmId: number,
  locationId: number,
  batchId: number,
  productId: number,
  quantityDelta: number,
): Promise<void> {
  await trx.raw(
    'INSERT INTO stock_balances (firm_id, location_id, batch_id, product_id, quantity) VALUES (?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE quantity = quantity + VALUES(quantity)',
    [firmId, locationId, batchId, productId, quantityDelta],
  );
}

/** Packs of a batch at a place, or undefined with no balance row; forUpdate locks the row for a stocktake. */
export async function findBalanceQuantity(
  db: Db,
  firmId: number,
  locationId: number,
  batchId: number,
  opts: { forUpdate?: boolean } = {},
): Promise<number | undefined> {
  const q = db('stock_balances')
    .where({ firm_id: firmId, location_id: locationId, batch_id: batchId })
    .first('quantity');
  if (opts.forUpdate) q.forUpdate();
  const row = (await q) as { quantity: number } | undefined;
  return row?.quantity;
}

/** The product, lot and place of a line, in words, for a refusal. */
export async function describeStockAt(db: Db, firmId: number, batchId: number, locationId: number) {
  return (await db('product_batches as b')
    .join('products as p', 'p.id', 'b.product_id')
    .join('locations as l', (j) => j.on('l.firm_id', '=', 'b.firm_id'))
    .where({ 'b.firm_id': firmId, 'b.id': batchId, 'l.id': locationId })
    .first('p.name as product', 'b.lot_number as lot', 'l.name as place')) as
    { product: string; lot: string; place: string } | undefined;
}

/** Balances at a place, with batch expiry, for allocation. */
export async function balancesAt(db: Db, firmId: number, locationId: number, productId?: number) {
  const q = db('stock_balances as s')
    .join('product_batches as b', (j) => j.on('b.id', '=', 's.batch_id').andOn('b.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': firmId, 's.location_id': locationId })
    .where('s.quantity', '>', 0)
    .select('s.batch_id', 's.product_id', 's.quantity', 'b.lot_number', 'b.expires_on');
  if (productId !== undefined) q.where('s.product_id', productId);
  return q as Promise<
    { batch_id: number; product_id: number; quantity: number; lot_number: string; expires_on: string }[]
  >;
}

export async function insertMovements(trx: Trx, firmId: number, rows: NewMovementRow[]): Promise<void> {
  await trx('stock_movements').insert(rows.map((r) => ({ firm_id: firmId, ...r })));
}

export async function listMovementIdsOfGroup(db: Db, firmId: number, groupId: string): Promise<number[]> {
  const rows = (await db('stock_movements').where({ firm_id: firmId, group_id: groupId }).select('id')) as {
    id: number;
  }[];
  return rows.map((m) => Number(m.id));
}

export async function findMovementForUpdate(trx: Trx, firmId: number, id: number): Promise<MovementRow | undefined> {
  return trx('stock_movements').where({ firm_id: firmId, id }).forUpdate().first();
}

export async function listGroupMovementsForUpdate(trx: Trx, firmId: number, groupId: string): Promise<MovementRow[]> {
  return trx('stock_movements').where({ firm_id: firmId, group_id: groupId }).forUpdate();
}

/** Whether any of these movements has been reversed already. */
export async function anyReversed(db: Db, firmId: number, movementIds: number[]): Promise<boolean> {
  return Boolean(
    await db('stock_movements').where('firm_id', firmId).whereIn('reverses_movement_id', movementIds).first('id'),
  );
}

/**
 * Packs used per product from an instant, up to another if given (the ledger's 'used' rows are negative;
 * this is their sum), by the covering index stock_movements_usage_by_month.
 */
export async function sumUsedByProductSince(db: Db, firmId: number, since: Date, until?: Date) {
  const q = db('stock_movements').where({ firm_id: firmId, kind: 'used' }).where('created_at', '>=', since);
  if (until) q.where('created_at', '<', until);
  return (await q.groupBy('product_id').select('product_id').sum({ n: 'quantity_delta' })) as {
    product_id: number;
    n: string;
  }[];
}
