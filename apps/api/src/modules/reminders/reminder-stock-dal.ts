import type { Knex } from 'knex';
import type { CalendarDate } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

// What the scan reads about stock: places, products, arrivals, usage and batches near expiry.

export interface StockPlace {
  id: number;
  kind: 'van' | 'depot';
  name: string;
  registration: string | null;
  engineerMemberId: number | null;
}

/** The firm's active vans and depots, depots first (the first depot is the one the restock run draws on). */
export async function listStockPlaces(db: Db, firmId: number): Promise<StockPlace[]> {
  const rows = (await db('locations')
    .where({ firm_id: firmId, active: true })
    .whereIn('kind', ['van', 'depot'])
    .select('id', 'kind', 'name', 'registration', 'engineer_member_id')
    .orderBy([{ column: 'kind' }, { column: 'id' }])) as {
    id: number;
    kind: 'van' | 'depot';
    name: string;
    registration: string | null;
    engineer_member_id: number | null;
  }[];
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    name: r.name,
    registration: r.registration,
    engineerMemberId: r.engineer_member_id,
  }));
}

export async function listActiveProducts(db: Db, firmId: number): Promise<{ id: number; name: string }[]> {
  return (await db('products').where({ firm_id: firmId, active: true }).select('id', 'name').orderBy('name')) as {
    id: number;
    name: string;
  }[];
}

/** The newest movement that added stock of a product at a place (received, transferred in, counted up, reversed back), if any. */
export async function latestArrivalId(
  db: Db,
  firmId: number,
  locationId: number,
  productId: number,
): Promise<number | null> {
  const row = (await db('stock_movements')
    .where({ firm_id: firmId, location_id: locationId, product_id: productId })
    .where('quantity_delta', '>', 0)
    .orderBy('id', 'desc')
    .first('id')) as { id: number | string } | undefined;
  return row ? Number(row.id) : null;
}

/** Packs used per product across the firm since an instant (the reorder list's 90 days). */
export async function packsUsedSince(db: Db, firmId: number, since: Date): Promise<Map<number, number>> {
  const rows = (await db('stock_movements')
    .where({ firm_id: firmId, kind: 'used' })
    .where('created_at', '>=', since)
    .groupBy('product_id')
    .select('product_id')
    .sum({ n: 'quantity_delta' })) as { product_id: number; n: string | number }[];
  return new Map(rows.map((r) => [r.product_id, -Number(r.n)]));
}

export interface BatchHeld {
  batchId: number;
  lotNumber: string;
  expiresOn: CalendarDate;
  productName: string;
  /** Packs per place holding it, largest first. */
  places: { name: string; quantity: number }[];
}

/**
 * Batches of active products with stock somewhere that expire on or before `lastDay` (already expired included).
 * The index with the packs in it is named: left to choose, MariaDB took the foreign key's and read every place's
 * row of each lot, used up or not (migrations/20261204183000_index-held-lots-by-batch.ts).
 */
export async function listBatchesHeldExpiringBy(db: Db, firmId: number, lastDay: CalendarDate): Promise<BatchHeld[]> {
  const rows = (await db
    .from(db.raw('?? as ?? force index (??)', ['stock_balances', 's', 'stock_balances_firm_batch_quantity']))
    .join('product_batches as b', (j) => j.on('b.id', '=', 's.batch_id').andOn('b.firm_id', '=', 's.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 's.product_id').andOn('p.firm_id', '=', 's.firm_id'))
    .join('locations as l', (j) => j.on('l.id', '=', 's.location_id').andOn('l.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', firmId)
    .where('s.quantity', '>', 0)
    .where('b.expires_on', '<=', lastDay)
    .where('p.active', true)
    .select(
      'b.id as batch_id',
      'b.lot_number',
      'b.expires_on',
      'p.name as product_name',
      'l.name as location_name',
      's.quantity',
    )
    .orderBy([
      { column: 'b.expires_on' },
      { column: 'p.name' },
      { column: 'b.lot_number' },
      { column: 's.quantity', order: 'desc' },
      { column: 'l.name' },
    ])) as {
    batch_id: number;
    lot_number: string;
    expires_on: string;
    product_name: string;
    location_name: string;
    quantity: number;
  }[];
  const byBatch = new Map<number, BatchHeld>();
  for (const r of rows) {
    const batch = byBatch.get(r.batch_id) ?? {
      batchId: r.batch_id,
      lotNumber: r.lot_number,
      expiresOn: r.expires_on,
      productName: r.product_name,
      places: [],
    };
    batch.places.push({ name: r.location_name, quantity: r.quantity });
    byBatch.set(r.batch_id, batch);
  }
  return [...byBatch.values()];
}
