import { ForbiddenError } from '@casl/ability';
import {
  DEFAULT_TIME_ZONE,
  stockHealthOf,
  stockNeedOf,
  type BatchStockRow,
  type LedgerPage,
  type LedgerQuery,
  type MyVanStock,
  type StockCell,
  type StockGrid,
  type StockGridQuery,
} from '@heatfleet/domain';
import type { Knex } from 'knex';
import type { Actor, AppDeps } from '../../app-deps.ts';
import { findVanOfMember } from '../locations/location-dal.ts';
import { findFirm } from '../firms/firm-dal.ts';
import { firmToday } from '../firms/firm-today.ts';
import { firmBookedJobs } from './booked-need-service.ts';
import { listActiveProductSummaries, listBatchExpiries, listProductOrderRefs } from './product-dal.ts';
import {
  listActivePlaces,
  listBalanceRows,
  listHeldBatchRows,
  listParLevelRows,
  sumActiveBalancesByBatch,
} from './stock-level-dal.ts';
import { movementsCsv } from './stock-csv.ts';
import { listLedgerMovements, type LedgerFilters } from './stock-movement-dal.ts';

type Db = Knex | Knex.Transaction;

/**
 * Usable (in-date) and expired packs per place and product, and the par levels, for the whole firm or
 * some places, by place and then product. Read as plain rows and added up here: joined and grouped in
 * SQL, MariaDB drove the join from the batches by the firm's index and grouped in a temporary table
 * (1 s for 200 vans x 100 products). Each cell is made once and filled in place, keyed by number: made
 * with string keys and copied at the end, the 20,000 cells of 200 vans x 100 products took 250-500 ms
 * of the CPU per request (measured with packages/bench/src/measure-reads.ts --profile).
 */
export async function stockLevels(
  db: Db,
  firmId: number,
  today: string,
  /**
   * `keepEmpty`: a cell also for a product whose lots there all hold 0 packs and which has no par level or
   * booked job (My van lists it); elsewhere such a cell reads the same as none and is left out.
   */
  where: { locationIds?: number[]; keepEmpty?: boolean } = {},
  /**
   * Packs booked jobs need, keyed by `vanProductKey` (see booked-need-service.ts); none: par levels alone. A
   * promise is awaited beside this function's own reads (the booked jobs took 30 ms of the overview before them).
   */
  bookedNeed: Map<string, number> | Promise<Map<string, number>> = new Map(),
): Promise<StockCell[]> {
  if (where.locationIds?.length === 0) return [];
  const [balanceRows, batchRows, parRows, booked] = await Promise.all([
    listBalanceRows(db, firmId, where.locationIds, where.keepEmpty),
    listBatchExpiries(db, firmId),
    listParLevelRows(db, firmId, where.locationIds),
    bookedNeed,
  ]);
  const expiresOn = new Map(batchRows.map((b) => [b.id, b.expires_on]));
  const byPlace = new Map<number, Map<number, StockCell>>();
  const cellAt = (locationId: number, productId: number): StockCell => {
    let place = byPlace.get(locationId);
    if (!place) byPlace.set(locationId, (place = new Map()));
    let cell = place.get(productId);
    if (!cell) {
      cell = { locationId, productId, usable: 0, expired: 0, par: null, booked: 0, need: null, health: 'no_par' };
      place.set(productId, cell);
    }
    return cell;
  };
  for (const r of balanceRows) {
    const expiry = expiresOn.get(r.batch_id);
    if (expiry === undefined) continue;
    const cell = cellAt(r.location_id, r.product_id);
    if (expiry >= today) cell.usable += Number(r.quantity);
    else cell.expired += Number(r.quantity);
  }
  for (const p of parRows) cellAt(p.location_id, p.product_id).par = { minimum: p.minimum, target: p.target };
  const only = where.locationIds && new Set(where.locationIds);
  for (const [k, packs] of booked) {
    const [locationId, productId] = k.split(':').map(Number) as [number, number];
    if (only && !only.has(locationId)) continue;
    cellAt(locationId, productId).booked = packs;
  }
  const cells: StockCell[] = [];
  const byNumber = (a: number, b: number) => a - b;
  for (const locationId of [...byPlace.keys()].sort(byNumber)) {
    const place = byPlace.get(locationId)!;
    for (const productId of [...place.keys()].sort(byNumber)) {
      const cell = place.get(productId)!;
      cell.need = stockNeedOf(cell.par, cell.booked);
      cell.health = stockHealthOf(cell.usable, cell.par, cell.booked);
      cells.push(cell);
    }
  }
  return cells;
}

/**
 * A page of the stock grid: the places of the page (depots first, then by name) with their cells, every
 * place's name (the stock forms choose from them), and each product's totals over every place, so a
 * page of 20 places costs a tenth of the 200-van firm's whole grid (2.4 MB of JSON when unpaged).
 */
export async function stockGrid(deps: AppDeps, actor: Actor, query: StockGridQuery): Promise<StockGrid> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const [products, places, booked, batchTotals, batchRows] = await Promise.all([
    listActiveProductSummaries(deps.db, actor.firmId),
    listActivePlaces(deps.db, actor.firmId),
    firmBookedJobs(deps.db, actor.firmId, today),
    sumActiveBalancesByBatch(deps.db, actor.firmId),
    listBatchExpiries(deps.db, actor.firmId),
  ]);
  const pageCount = Math.max(1, Math.ceil(places.length / query.limit));
  const locations = places.slice((query.page - 1) * query.limit, query.page * query.limit);
  const cells = await stockLevels(
    deps.db,
    actor.firmId,
    today,
    { locationIds: locations.map((l) => l.id) },
    booked.packs,
  );
  const expiresOn = new Map(batchRows.map((b) => [b.id, b.expires_on]));
  const totals = new Map(products.map((p) => [p.id, { productId: p.id, usable: 0, expired: 0, booked: 0 }]));
  for (const b of batchTotals) {
    const total = totals.get(b.product_id);
    const expiry = expiresOn.get(b.batch_id);
    if (!total || expiry === undefined) continue;
    if (expiry >= today) total.usable += Number(b.quantity);
    else total.expired += Number(b.quantity);
  }
  const active = new Set(places.map((p) => p.id));
  for (const [k, packs] of booked.packs) {
    const [locationId, productId] = k.split(':').map(Number) as [number, number];
    const total = totals.get(productId);
    if (total && active.has(locationId)) total.booked += packs;
  }
  return {
    today,
    restockDays: booked.days,
    products,
    locations,
    places,
    page: { page: query.page, limit: query.limit, placeCount: places.length, pageCount },
    cells,
    totals: [...totals.values()],
  };
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

/** The signed-in engineer's van stock, with product names; no van, nothing to show. */
export async function myVanStock(deps: AppDeps, actor: Actor): Promise<MyVanStock> {
  const van = await findVanOfMember(deps.db, actor.firmId, actor.memberId);
  if (!van) return { van: null, stock: [], batches: [] };
  const today = await firmToday(deps.db, actor.firmId, deps.clock.now());
  const [booked, batches, products] = await Promise.all([
    firmBookedJobs(deps.db, actor.firmId, today, { vanId: van.id }),
    batchesAt(deps, actor, { locationId: van.id }),
    listProductOrderRefs(deps.db, actor.firmId),
  ]);
  const levels = await stockLevels(
    deps.db,
    actor.firmId,
    today,
    { locationIds: [van.id], keepEmpty: true },
    booked.packs,
  );
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

/** Movements read at a time while the ledger's CSV is written. */
export const LEDGER_CSV_PAGE_ROWS = 2_000;

/**
 * The ledger with the same filters as CSV, newest first, up to LEDGER_CSV_MAX_ROWS rows, in pieces: the header,
 * then one keyset page at a time, so an export holds one page in memory (100,000 movements read at once needed
 * more than 190 MiB of heap; README, "Round two"). The permission and the firm's zone are settled before the first
 * piece, so a refusal is still a plain 403. Rows written during the export have higher ids and are not in it.
 */
export async function exportLedgerCsv(
  deps: AppDeps,
  actor: Actor,
  query: LedgerFilters,
  pageRows = LEDGER_CSV_PAGE_ROWS,
): Promise<AsyncIterable<string>> {
  ForbiddenError.from(actor.ability).throwUnlessCan('read', 'Stock');
  const timeZone = await firmTimeZone(deps, actor);
  return (async function* pieces() {
    yield movementsCsv([], timeZone);
    let before: number | undefined;
    for (let sent = 0; sent < LEDGER_CSV_MAX_ROWS;) {
      const limit = Math.min(pageRows, LEDGER_CSV_MAX_ROWS - sent);
      const page = await listLedgerMovements(deps.db, actor.firmId, query, { limit, before, timeZone });
      if (page.length > 0) yield movementsCsv(page, timeZone, { header: false });
      sent += page.length;
      if (page.length < limit) return;
      before = page[page.length - 1]!.id;
    }
  })();
}
