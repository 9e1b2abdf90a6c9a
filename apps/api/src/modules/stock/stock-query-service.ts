import { ForbiddenError } from '@casl/ability';
import { stockHealthOf, type LedgerQuery, type Movement } from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { firmToday } from '../firms/firm-today.ts';

type Db = Knex | Knex.Transaction;

/**
 * Usable (in-date) and expired packs per place and product, and the par levels, for the whole firm.
 * Read as plain rows and added up here: joined and grouped in SQL, MariaDB drove the join from the
 * batches by the firm's index and grouped in a temporary table (1 s for 200 vans x 100 products).
 */
export async function stockLevels(db: Db, firmId: number, today: string, where: { locationId?: number } = {}) {
  const balances = db('stock_balances').where('firm_id', firmId).select('location_id', 'product_id', 'batch_id', 'quantity');
  if (where.locationId) balances.where('location_id', where.locationId);
  const pars = db('par_levels').where('firm_id', firmId).select('location_id', 'product_id', 'minimum', 'target');
  if (where.locationId) pars.where('location_id', where.locationId);
  const [balanceRows, batchRows, parRows] = await Promise.all([
    balances as Promise<{ location_id: number; product_id: number; batch_id: number; quantity: number }[]>,
    db('product_batches').where('firm_id', firmId).select('id', 'expires_on') as Promise<{ id: number; expires_on: string }[]>,
    pars as Promise<{ location_id: number; product_id: number; minimum: number; target: number }[]>,
  ]);
  const expiresOn = new Map(batchRows.map((b) => [b.id, b.expires_on]));
  const sums = new Map<string, { location_id: number; product_id: number; usable: number; expired: number }>();
  for (const r of balanceRows) {
    const expiry = expiresOn.get(r.batch_id);
    if (expiry === undefined) continue;
    const k = `${r.location_id}:${r.product_id}`;
    const sum = sums.get(k) ?? { location_id: r.location_id, product_id: r.product_id, usable: 0, expired: 0 };
    if (expiry >= today) sum.usable += r.quantity;
    else sum.expired += r.quantity;
    sums.set(k, sum);
  }
  // The order GROUP BY gave: by place, then product.
  const levels = [...sums.values()].sort((x, y) => x.location_id - y.location_id || x.product_id - y.product_id);
  const key = (l: number, p: number) => `${l}:${p}`;
  const cells = new Map<string, { locationId: number; productId: number; usable: number; expired: number; par: { minimum: number; target: number } | null }>();
  for (const l of levels) cells.set(key(l.location_id, l.product_id), { locationId: l.location_id, productId: l.product_id, usable: Number(l.usable), expired: Number(l.expired), par: null });
  for (const p of parRows) {
    const c = cells.get(key(p.location_id, p.product_id)) ?? { locationId: p.location_id, productId: p.product_id, usable: 0, expired: 0, par: null };
    c.par = { minimum: p.minimum, target: p.target };
    cells.set(key(p.location_id, p.product_id), c);
  }
  return [...cells.values()].map((c) => ({ ...c, health: stockHealthOf(c.usable, c.par) }));
}

export async function stockGrid(deps: AppDeps, actor: Actor) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const [products, locations, cells] = await Promise.all([
    deps.db('products').where({ firm_id: actor.firmId, active: true }).orderBy('name').select('id', 'name', 'kind', 'pack_size_ml as packSizeMl'),
    deps.db('locations').where({ firm_id: actor.firmId, active: true }).orderBy([{ column: 'kind' }, { column: 'name' }]).select('id', 'kind', 'name', 'registration'),
    stockLevels(deps.db, actor.firmId, today),
  ]);
  return { today, products, locations, cells };
}

export async function batchesAt(deps: AppDeps, actor: Actor, where: { locationId?: number; productId?: number }) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const q = deps.db('stock_balances as s')
    .join('product_batches as b', (j) => j.on('b.id', '=', 's.batch_id').andOn('b.firm_id', '=', 's.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 's.product_id').andOn('p.firm_id', '=', 's.firm_id'))
    .join('locations as l', (j) => j.on('l.id', '=', 's.location_id').andOn('l.firm_id', '=', 's.firm_id'))
    .where('s.firm_id', actor.firmId)
    .where('s.quantity', '>', 0)
    .orderBy([{ column: 'l.name' }, { column: 'p.name' }, { column: 'b.expires_on' }])
    .select('s.location_id', 'l.name as location_name', 's.product_id', 'p.name as product_name', 's.batch_id', 'b.lot_number', 'b.expires_on', 's.quantity');
  if (where.locationId) q.where('s.location_id', where.locationId);
  if (where.productId) q.where('s.product_id', where.productId);
  const rows = (await q) as { location_id: number; location_name: string; product_id: number; product_name: string; batch_id: number; lot_number: string; expires_on: string; quantity: number }[];
  return rows.map((r) => ({
    location: { id: r.location_id, name: r.location_name },
    product: { id: r.product_id, name: r.product_name },
    batch: { id: r.batch_id, lotNumber: r.lot_number, expiresOn: r.expires_on },
    quantity: r.quantity,
    expired: r.expires_on < today,
  }));
}

/**
 * The ledger rows wanted, newest first, picked from stock_movements alone (its firm_id-led indexes give
 * them in id order), then joined to their names. Joined in one query, MariaDB started from the small
 * tables and sorted the firm's whole ledger for every page (140 s a page at a million movements).
 */
function ledgerRows(db: Db, firmId: number, query: Omit<LedgerQuery, 'limit' | 'before'>, page: { limit: number; before?: number; ids?: number[] }) {
  // Named, because left to itself MariaDB 10.11 walks the primary key (or the firm's whole index
  // entry) from the top and filters: 0.3 s for a first page and 5 s for a deep one at a million rows.
  const index = query.locationId ? 'stock_movements_firm_id_location_id_id_index' : query.productId ? 'stock_movements_firm_id_product_id_id_index' : 'stock_movements_firm_id_id_index';
  const picked = db
    .from(db.raw('?? FORCE INDEX (??)', ['stock_movements', index]))
    .where('firm_id', firmId).orderBy('id', 'desc').limit(page.limit).select('*');
  if (query.locationId) picked.where('location_id', query.locationId);
  if (query.productId) picked.where('product_id', query.productId);
  if (query.kind) picked.where('kind', query.kind);
  // Day bounds in UTC: a day filter is a convenience, the ledger itself keeps exact instants.
  if (query.from) picked.where('created_at', '>=', new Date(`${query.from}T00:00:00Z`));
  if (query.to) picked.where('created_at', '<', new Date(Date.parse(`${query.to}T00:00:00Z`) + 86_400_000));
  if (page.before) picked.where('id', '<', page.before);
  if (page.ids) picked.whereIn('id', page.ids);
  return db
    .from(picked.as('m'))
    .join('locations as l', (j) => j.on('l.id', '=', 'm.location_id').andOn('l.firm_id', '=', 'm.firm_id'))
    .join('products as p', (j) => j.on('p.id', '=', 'm.product_id').andOn('p.firm_id', '=', 'm.firm_id'))
    .join('product_batches as b', (j) => j.on('b.id', '=', 'm.batch_id').andOn('b.firm_id', '=', 'm.firm_id'))
    .join('users as u', 'u.id', 'm.by_user_id')
    .orderBy('m.id', 'desc')
    .select('m.*', 'l.name as location_name', 'p.name as product_name', 'b.lot_number', 'b.expires_on', 'u.name as by_name');
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
  };
}

/** A page of the ledger, newest first, by keyset (id below the cursor): as quick deep in as at the top. */
export async function ledgerPage(deps: AppDeps, actor: Actor, query: LedgerQuery) {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const rows = (await ledgerRows(deps.db, actor.firmId, query, { limit: query.limit + 1, before: query.before })) as Record<string, unknown>[];
  const page = rows.slice(0, query.limit).map(toMovement);
  return { movements: page, nextCursor: rows.length > query.limit ? page[page.length - 1]!.id : null };
}

export const LEDGER_CSV_MAX_ROWS = 100_000;

export async function ledgerForExport(deps: AppDeps, actor: Actor, query: Omit<LedgerQuery, 'limit' | 'before'>): Promise<Movement[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  return ((await ledgerRows(deps.db, actor.firmId, query, { limit: LEDGER_CSV_MAX_ROWS })) as Record<string, unknown>[]).map(toMovement);
}

export async function movementsByIds(db: Db, firmId: number, ids: number[]): Promise<Movement[]> {
  if (ids.length === 0) return [];
  return ((await ledgerRows(db, firmId, {}, { limit: ids.length, ids })) as Record<string, unknown>[]).map(toMovement);
}
