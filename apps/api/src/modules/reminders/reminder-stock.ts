import type { Knex } from 'knex';
import {
  addDays,
  BATCH_EXPIRY_WINDOW_DAYS,
  daysBetween,
  formatUkCalendarDate,
  planReorder,
  planRestock,
  type BatchStock,
  type CalendarDate,
  type ReorderLine,
} from '@heatfleet/domain';
import { balancesAt } from '../stock/stock-ledger.ts';
import { stockLevels } from '../stock/stock-query-service.ts';
import type { NewReminder } from './reminder-dal.ts';
import {
  latestArrivalId,
  listActiveProducts,
  listBatchesHeldExpiringBy,
  listStockPlaces,
  packsUsedSince,
  type BatchHeld,
  type StockPlace,
} from './reminder-stock-dal.ts';

type Db = Knex | Knex.Transaction;

/** A stock reminder found by the scan, with the engineer whose van it is about (for their own digest). */
export interface StockCandidate extends NewReminder {
  vanEngineerMemberId: number | null;
}

// The reorder list's usage window (DEVELOPERS.md, Product rules: days of cover from the last 90 days' usage).
const USAGE_WINDOW_MS = 90 * 86_400_000;

const packs = (n: number) => `${n} pack${n === 1 ? '' : 's'}`;
const placeLabel = (p: StockPlace) => (p.registration ? `${p.name} (${p.registration})` : p.name);

/**
 * The period of a "below minimum" reminder is the dip, named by the newest movement that added
 * stock of that product at that place (`in0` when none ever did). Between two arrivals the usable
 * stock only falls (uses, transfers out, write-offs, batches passing their expiry), so it crosses
 * under the minimum at most once: one reminder per dip, however many daily scans see it. A dip ends
 * only when stock arrives; an arrival that leaves it still under names a new period and reminds
 * again, which is wanted: the top-up fell short. Keying on the movement that took it under was
 * rejected because expiry takes stock under with no movement at all, and a calendar week would
 * repeat the reminder every week of a long dip.
 */
async function dipPeriod(
  db: Db,
  firmId: number,
  locationId: number,
  productId: number,
  prefix: string,
): Promise<string> {
  return `${prefix}:in${(await latestArrivalId(db, firmId, locationId, productId)) ?? 0}`;
}

function reorderSummary(line: ReorderLine, productName: string, depot: StockPlace, afterRestock: boolean): string {
  const cover =
    line.daysOfCover === null
      ? 'none used in the last 90 days'
      : `about ${line.daysOfCover} day${line.daysOfCover === 1 ? '' : 's'} of cover at the last 90 days' use`;
  const usable = `${line.usableAfterTransfers} usable${afterRestock ? ' after the planned restock' : ''}`;
  return `${productName} at ${depot.name}: ${usable}, under its minimum of ${line.par.minimum}; order ${packs(line.orderQuantity)} to reach ${line.par.target} (${cover})`;
}

function batchSummary(batch: BatchHeld, today: CalendarDate): string {
  const days = daysBetween(today, batch.expiresOn);
  const when =
    days < 0
      ? `expired on ${formatUkCalendarDate(batch.expiresOn)}, write it off`
      : days === 0
        ? `expires today (${formatUkCalendarDate(batch.expiresOn)})`
        : `expires on ${formatUkCalendarDate(batch.expiresOn)} (in ${days} day${days === 1 ? '' : 's'})`;
  const total = batch.places.reduce((n, p) => n + p.quantity, 0);
  const where = batch.places.map((p) => `${p.name} ${p.quantity}`).join(', ');
  return `${batch.productName} lot ${batch.lotNumber}: ${when}; ${packs(total)} held: ${where}`;
}

/**
 * Vans under their minimum, depots that need a reorder once the restock run has been planned, and
 * batches held anywhere that expire within the window. The restock and reorder figures come from the
 * same domain computations as the Restock run and Reorder list screens, over active products only
 * (a discontinued product is not restocked, so reminding about it is noise).
 */
export async function stockCandidates(
  db: Db,
  firmId: number,
  today: CalendarDate,
  now: Date,
): Promise<StockCandidate[]> {
  const [places, products, levels] = await Promise.all([
    listStockPlaces(db, firmId),
    listActiveProducts(db, firmId),
    stockLevels(db, firmId, today),
  ]);
  const productName = new Map(products.map((p) => [p.id, p.name]));
  const placeById = new Map(places.map((p) => [p.id, p]));
  const vanCells = levels.filter(
    (c) => placeById.get(c.locationId)?.kind === 'van' && productName.has(c.productId) && c.par !== null,
  );
  const found: StockCandidate[] = [];

  for (const cell of vanCells) {
    const par = cell.par!;
    if (cell.usable >= par.minimum) continue;
    const van = placeById.get(cell.locationId)!;
    const expired = cell.expired > 0 ? `; ${packs(cell.expired)} expired to write off` : '';
    found.push({
      kind: 'van_below_minimum',
      subjectType: 'van',
      subjectId: van.id,
      periodKey: await dipPeriod(db, firmId, van.id, cell.productId, `p${cell.productId}`),
      summary: `${placeLabel(van)}: ${productName.get(cell.productId)!} ${cell.usable} usable, under its minimum of ${par.minimum} (target ${par.target})${expired}`,
      vanEngineerMemberId: van.engineerMemberId,
    });
  }

  const depots = places.filter((p) => p.kind === 'depot');
  if (depots.length > 0) {
    const used = await packsUsedSince(db, firmId, new Date(now.getTime() - USAGE_WINDOW_MS));
    // The restock run draws on the first depot (as the Restock run screen does by default); any
    // other depot is held to its own minimum with nothing planned out of it.
    for (const [index, depot] of depots.entries()) {
      const batches = new Map<number, BatchStock[]>();
      for (const b of await balancesAt(db, firmId, depot.id)) {
        batches.set(b.product_id, [
          ...(batches.get(b.product_id) ?? []),
          { batchId: b.batch_id, lotNumber: b.lot_number, expiresOn: b.expires_on, quantity: b.quantity },
        ]);
      }
      const restock =
        index === 0
          ? planRestock(
              vanCells.map((c) => ({
                locationId: c.locationId,
                productId: c.productId,
                usable: c.usable,
                par: c.par!,
              })),
              batches,
              today,
            )
          : [];
      const depotPar = new Map(
        levels.filter((c) => c.locationId === depot.id && c.par !== null).map((c) => [c.productId, c.par!]),
      );
      const reorder = planReorder(
        products.map((p) => ({
          productId: p.id,
          depotBatches: batches.get(p.id) ?? [],
          par: depotPar.get(p.id) ?? null,
          used90Days: used.get(p.id) ?? 0,
        })),
        restock,
        today,
      );
      for (const line of reorder) {
        found.push({
          kind: 'depot_reorder',
          subjectType: 'product',
          subjectId: line.productId,
          periodKey: await dipPeriod(db, firmId, depot.id, line.productId, `d${depot.id}`),
          summary: reorderSummary(line, productName.get(line.productId)!, depot, index === 0),
          vanEngineerMemberId: null,
        });
      }
    }
  }

  for (const batch of await listBatchesHeldExpiringBy(db, firmId, addDays(today, BATCH_EXPIRY_WINDOW_DAYS))) {
    found.push({
      kind: 'batch_expiring',
      subjectType: 'batch',
      subjectId: batch.batchId,
      // One reminder per batch and expiry date: it is not repeated on the day it expires.
      periodKey: batch.expiresOn,
      summary: batchSummary(batch, today),
      vanEngineerMemberId: null,
    });
  }
  return found;
}
