import type { Knex } from 'knex';
import { firmDayEnd, firmDayStart, type LedgerQuery, type Movement } from '@heatfleet/domain';

type Db = Knex | Knex.Transaction;

export type LedgerFilters = Omit<LedgerQuery, 'limit' | 'before'>;

/**
 * The ledger rows wanted, newest first, picked from stock_movements alone (its firm_id-led indexes give
 * them in id order), then joined to their names. Joined in one query, MariaDB started from the small
 * tables and sorted the firm's whole ledger for every page (140 s a page at a million movements).
 */
function ledgerRows(
  db: Db,
  firmId: number,
  query: LedgerFilters,
  page: { limit: number; before?: number | undefined; ids?: number[]; timeZone?: string },
) {
  // Named, because left to itself MariaDB 10.11 walks the primary key (or the firm's whole index
  // entry) from the top and filters: 0.3 s for a first page and 5 s for a deep one at a million rows.
  const index = query.locationId
    ? 'stock_movements_firm_id_location_id_id_index'
    : query.productId
      ? 'stock_movements_firm_id_product_id_id_index'
      : 'stock_movements_firm_id_id_index';
  const picked = db
    .from(db.raw('?? FORCE INDEX (??)', ['stock_movements', index]))
    .where('firm_id', firmId)
    .orderBy('id', 'desc')
    .limit(page.limit)
    .select('*');
  if (query.locationId) picked.where('location_id', query.locationId);
  if (query.productId) picked.where('product_id', query.productId);
  if (query.kind) picked.where('kind', query.kind);
  // Days are the firm's (issue 14): a movement at 23:30 UTC on a summer day belongs to the next day in London.
  const zone = page.timeZone ?? 'UTC';
  if (query.from) picked.where('created_at', '>=', firmDayStart(query.from, zone));
  if (query.to) picked.where('created_at', '<', firmDayEnd(query.to, zone));
  if (page.before) picked.where('id', '<', page.before);
  if (page.ids) picked.whereIn('id', page.ids);
  return db
    .from(picked.as('m'))
    .join('locations as l', (j) => j.on('l.id', '=', 'm.location_id').andOn('l.firm_id', '=', 'm.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 'm.product_id').andOn('p.firm_id', '=', 'm.firm_id'))
    .join('product_batches as b', (j) => j.on('b.id', '=', 'm.batch_id').andOn('b.firm_id', '=', 'm.firm_id'))
    .join('users as u', 'u.id', 'm.by_user_id')
    .orderBy('m.id', 'desc')
    .select(
      'm.*',
      'l.name as location_name',
      'p.name as product_name',
      'b.lot_number',
      'b.expires_on',
      'u.name as by_name',
    );
}

function toMovement(r: Record<string, unknown>): Movement {
  return {
    id: Number(r.id),
    groupId: r.group_id as string,
    kind: r.kind as Movement['kind'],
    location: { id: r.location_id as number, name: r.location_name as string },
    product: { id: r.product_id as number, name: r.product_name as string },
    batch: { id: r.batch_id as number, lotNumber: r.lot_number as string, expiresOn: r.expires_on as string },
    quantityDelta: r.quantity_delta as number,
    reason: (r.reason as string | null) ?? null,
    reference: (r.reference as string | null) ?? null,
    reversesMovementId: r.reverses_movement_id === null ? null : Number(r.reverses_movement_id),
    byName: r.by_name as string,
    createdAt: (r.created_at as Date).toISOString(),
    tappedAt: r.tapped_at ? (r.tapped_at as Date).toISOString() : null,
  };
}

/** Up to `limit` movements matching the filters, newest first; `before` is the keyset cursor. */
export async function listLedgerMovements(
  db: Db,
  firmId: number,
  query: LedgerFilters,
  page: { limit: number; before?: number | undefined; timeZone?: string },
): Promise<Movement[]> {
  return ((await ledgerRows(db, firmId, query, page)) as Record<string, unknown>[]).map(toMovement);
}

export async function listMovementsByIds(db: Db, firmId: number, ids: number[]): Promise<Movement[]> {
  if (ids.length === 0) return [];
  return ((await ledgerRows(db, firmId, {}, { limit: ids.length, ids })) as Record<string, unknown>[]).map(toMovement);
}
