import type { Knex } from 'knex';
import type { ParLevelInput } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export interface ParLevelRow {
  location_id: number;
  product_id: number;
  minimum: number;
  target: number;
}

/**
 * Packs held per place and batch, for some places (by the primary key) or the whole firm; emptied lots
 * left out unless asked for (70% of the 1M bench firm's 60,331 balance rows hold 0 packs).
 */
export async function listBalanceRows(db: Db, firmId: number, locationIds?: number[], keepEmpty = false) {
  const q = db('stock_balances').where('firm_id', firmId).select('location_id', 'product_id', 'batch_id', 'quantity');
  if (locationIds) q.whereIn('location_id', locationIds);
  if (!keepEmpty) q.whereNot('quantity', 0);
  return q as Promise<{ location_id: number; product_id: number; batch_id: number; quantity: number }[]>;
}

/**
 * Packs of each product and batch over the firm's active places: the grid's totals. A few hundred rows
 * (one per batch) however many places hold them; the expiry is applied by the caller.
 */
export async function sumActiveBalancesByBatch(db: Db, firmId: number) {
  return (await db('stock_balances as s')
    .join('locations as l', (j) => j.on('l.id', '=', 's.location_id').andOn('l.firm_id', '=', 's.firm_id'))
    .where({ 's.firm_id': firmId, 'l.active': true })
    .whereNot('s.quantity', 0)
    .groupBy('s.batch_id', 's.product_id')
    .select('s.batch_id', 's.product_id')
    .sum({ quantity: 's.quantity' })) as { batch_id: number; product_id: number; quantity: string | number }[];
}

export async function listParLevelRows(db: Db, firmId: number, locationIds?: number[]): Promise<ParLevelRow[]> {
  const q = db('par_levels').where('firm_id', firmId).select('location_id', 'product_id', 'minimum', 'target');
  if (locationIds) q.whereIn('location_id', locationIds);
  return q;
}

/** Sets a product's minimum and target at a place, adding the row the first time. */
export async function upsertParLevel(db: Db, firmId: number, par: ParLevelInput): Promise<void> {
  await db.raw(
    'INSERT INTO par_levels (firm_id, location_id, product_id, minimum, target) VALUES (?, ?, ?, ?, ?) ON DUPLICATE KEY UPDATE minimum = VALUES(minimum), target = VALUES(target)',
    [firmId, par.locationId, par.productId, par.minimum, par.target],
  );
}

export async function locationExists(db: Db, firmId: number, id: number): Promise<boolean> {
  return Boolean(await db('locations').where({ firm_id: firmId, id }).first('id'));
}

/** Active depots and vans for the stock grid: depots first, then by name. */
export async function listActivePlaces(db: Db, firmId: number) {
  return (await db('locations')
    .where({ firm_id: firmId, active: true })
    .orderBy([{ column: 'kind' }, { column: 'name' }])
    .select('id', 'kind', 'name', 'registration')) as {
    id: number;
    kind: 'depot' | 'van';
    name: string;
    registration: string | null;
  }[];
}

export async function listActiveVanRefs(db: Db, firmId: number) {
  return (await db('locations')
    .where({ firm_id: firmId, kind: 'van', active: true })
    .select('id', 'name', 'registration')) as { id: number; name: string; registration: string | null }[];
}

/** Packs held by batch (lot and expiry), with place and product names, by place, product and expiry. */
export async function listHeldBatchRows(db: Db, firmId: number, where: { locationId?: number; productId?: number }) {
  const q = db('stock_balances as s')
    .join('product_batches as b', (j) => j.on('b.id', '=', 's.batch_id').andOn('b.firm_id', '=', 's.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 's.product_id').andOn('p.firm_id', '=', 's.firm_id'))
    .join('locations as l', (j) => j.on('l.id', '=', 's.location_id').andOn('l.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', firmId)
    .where('s.quantity', '>', 0)
    .orderBy([{ column: 'l.name' }, { column: 'p.name' }, { column: 'b.expires_on' }])
    .select(
      's.location_id',
      'l.name as location_name',
      's.product_id',
      'p.name as product_name',
      's.batch_id',
      'b.lot_number',
      'b.expires_on',
      's.quantity',
    );
  if (where.locationId) q.where('s.location_id', where.locationId);
  if (where.productId) q.where('s.product_id', where.productId);
  return q as Promise<
    {
      location_id: number;
      location_name: string;
      product_id: number;
      product_name: string;
      batch_id: number;
      lot_number: string;
      expires_on: string;
      quantity: number;
    }[]
  >;
}
