import { ForbiddenError } from '@casl/ability';
import {
  DEFAULT_TIME_ZONE,
  stockHealthOf,
  stockNeedOf,
  type BatchStockRow,
  type LedgerPage,
  type LedgerQuery,
  type Movement,
  type MyVanStock,
  type StockCell,
  type StockGrid,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { findVanOfMember } from '../locations/location-dal.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { firmToday } from '../firms/firm-today.ts';
import { firmBookedJobs } from './booked-need-service.ts';
import { listActiveProductSummaries, listBatchExpiries, listProductOrderRefs } from './product-dal.ts';
import { listActivePlaces, listBalanceRows, listHeldBatchRows, listParLevelRows } from './stock-level-dal.ts';
import { movementsCsv } from './stock-csv.ts';
import { listLedgerMovements, type LedgerFilters } from './stock-movement-dal.ts';

type Db = Knex | Knex.Transaction;

/**
 * Usable (in-date) and expired packs per place and product, and the par levels, for the whole firm.
 * Read as plain rows and added up here: joined and grouped in SQL, MariaDB drove the join from the
 * batches by the firm's index and grouped in a temporary table (1 s for 200 vans x 100 products).
 */
export async function stockLevels(
  db: Db,
  firmId: number,
  today: string,
  where: { locationId?: number } = {},
  /** Packs booked jobs need, keyed by `vanProductKey` (see booked-need-service.ts); none: par levels alone. */
  booked: Map<string, number> = new Map(),
): Promise<StockCell[]> {
  const [balanceRows, batchRows, parRows] = await Promise.all([
    listBalanceRows(db, firmId, where.locationId),
    listBatchExpiries(db, firmId),
    listParLevelRows(db, firmId, where.locationId),
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
  const cells = new Map<string, Omit<StockCell, 'health' | 'need'>>();
  for (const l of levels)
    cells.set(key(l.location_id, l.product_id), {
      locationId: l.location_id,
      productId: l.product_id,
      usable: Number(l.usable),
      expired: Number(l.expired),
      par: null,
      booked: 0,
    });
  for (const p of parRows) {
    const c = cells.get(key(p.location_id, p.product_id)) ?? {
      locationId: p.location_id,
      productId: p.product_id,
      usable: 0,
      expired: 0,
      par: null,
      booked: 0,
    };
    c.par = { minimum: p.minimum, target: p.target };
    cells.set(key(p.location_id, p.product_id), c);
  }
  for (const [k, packs] of booked) {
    const [locationId, productId] = k.split(':').map(Number) as [number, number];
    if (where.locationId && where.locationId !== locationId) continue;
    const c = cells.get(k) ?? { locationId, productId, usable: 0, expired: 0, par: null, booked: 0 };
    c.booked = packs;
    cells.set(k, c);
  }
  return [...cells.values()].map((c) => ({
    ...c,
    need: stockNeedOf(c.par, c.booked),
    health: stockHealthOf(c.usable, c.par, c.booked),
  }));
}

export async function stockGrid(deps: AppDeps, actor: Actor): Promise<StockGrid> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const [products, locations, booked] = await Promise.all([
    listActiveProductSummaries(deps.db, actor.firmId),
    listActivePlaces(deps.db, actor.firmId),
    firmBookedJobs(deps.db, actor.firmId, today),
  ]);
  const cells = await stockLevels(deps.db, actor.firmId, today, {}, booked.packs);
  return { today, restockDays: booked.days, products, locations, cells };
}

export async function batchesAt(
  deps: AppDeps,
  actor: Actor,
  where: { locationId?: number | undefined; productId?: number | undefined },
): Promise<BatchStockRow[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const rows = await listHeldBatchRows(deps.db, actor.firmId, where);
  return rows.map((r) => ({
    location: { id: r.location_id, name: r.location_name },
    product: { id: r.product_id, name: r.product_name },
    batch: { id: r.batch_id, lotNumber: r.lot_number, expiresOn: r.expires_on },
    quantity: r.quantity,
    expired: r.expires_on < today,
  }));
}

/** A page of the ledger, newest first, by keyset (id below the cursor): as quick deep in as at the top. */
export async function ledgerPage(deps: AppDeps, actor: Actor, query: LedgerQuery): Promise<LedgerPage> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const rows = await listLedgerMovements(deps.db, actor.firmId, query, {
    limit: query.limit + 1,
    before: query.before,
    timeZone: await firmTimeZone(deps, actor),
  });
  const page = rows.slice(0, query.limit);
  return { movements: page, nextCursor: rows.length > query.limit ? page[page.length - 1]!.id : null };
}

export const LEDGER_CSV_MAX_ROWS = 100_000;

async function firmTimeZone(deps: AppDeps, actor: Actor): Promise<string> {
  return (await findFirm(deps.db, actor.firmId))?.time_zone ?? DEFAULT_TIME_ZONE;
}

export async function ledgerForExport(
  deps: AppDeps,
  actor: Actor,
  query: LedgerFilters,
  timeZone?: string,
): Promise<Movement[]> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  return listLedgerMovements(deps.db, actor.firmId, query, {
    limit: LEDGER_CSV_MAX_ROWS,
    timeZone: timeZone ?? (await firmTimeZone(deps, actor)),
  });
}

/** The signed-in engineer's van stock, with product names; no van, nothing to show. */
export async function myVanStock(deps: AppDeps, actor: Actor): Promise<MyVanStock> {
  const van = await findVanOfMember(deps.db, actor.firmId, actor.memberId);
  if (!van) return { van: null, stock: [], batches: [] };
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const [booked, batches, products] = await Promise.all([
    firmBookedJobs(deps.db, actor.firmId, today),
    batchesAt(deps, actor, { locationId: van.id }),
    listProductOrderRefs(deps.db, actor.firmId),
  ]);
  const levels = await stockLevels(deps.db, actor.firmId, today, { locationId: van.id }, booked.packs);
  const byId = new Map(products.map((p) => [p.id, p]));
  return {
    van: { id: van.id, name: van.name, registration: van.registration },
    stock: levels.map((l) => ({
      ...l,
      productName: byId.get(l.productId)?.name ?? '',
      packSizeMl: byId.get(l.productId)?.packSizeMl ?? 0,
    })),
    batches,
  };
}

/** The ledger with the same filters, as CSV, up to LEDGER_CSV_MAX_ROWS rows. */
export async function exportLedgerCsv(deps: AppDeps, actor: Actor, query: LedgerFilters): Promise<string> {
  const timeZone = await firmTimeZone(deps, actor);
  return movementsCsv(await ledgerForExport(deps, actor, query, timeZone), timeZone);
}
