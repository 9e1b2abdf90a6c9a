import type { CalendarDate } from '../lib/calendar-date.ts';
import { allocateFefo, usableQuantity, type Allocation, type BatchStock } from './fefo.ts';
import { stockNeedOf } from './stock-health.ts';

export interface ParLevel {
  minimum: number;
  target: number;
}

export interface VanNeed {
  locationId: number;
  productId: number;
  /** Usable packs on the van now (expired batches do not count). */
  usable: number;
  /** The van's par level; null (or 0 and 0) when it has none. */
  par: ParLevel | null;
  /** Packs its booked jobs of the next days need (0 for par levels alone). */
  booked?: number;
}

export interface RestockLine {
  locationId: number;
  productId: number;
  usable: number;
  par: ParLevel;
  booked: number;
  /** What the van is filled to (see `stockNeedOf`). */
  need: ParLevel;
  wanted: number;
  allocations: Allocation[];
  shortfall: number;
}

/**
 * The restock run: every van below its need (its par target, or its booked jobs' packs plus its
 * minimum if that is more) gets what brings it up to it, taken from the depot's batches first
 * expiry first, while the depot lasts. Vans short for booked jobs or below their minimum are served
 * first (then the lowest relative to the need, then by id), so scarce stock goes where it is needed.
 */
export function planRestock(
  vans: VanNeed[],
  depotBatches: Map<number, BatchStock[]>,
  today: CalendarDate,
): RestockLine[] {
  // Each product's usable depot batches in first-expiry-first order, sorted once (not once per van): the
  // same order and the same picks as `allocateFefo`, for 200 vans x 100 products in one pass.
  const remaining = new Map<number, BatchStock[]>();
  for (const [productId, batches] of depotBatches)
    remaining.set(productId, allocateFefo(batches, Number.MAX_SAFE_INTEGER, today).allocations);
  const withNeed: { van: VanNeed; need: ParLevel; urgent: number; fill: number }[] = [];
  for (const van of vans) {
    const need = stockNeedOf(van.par, van.booked ?? 0);
    if (!need || van.usable >= need.target) continue;
    const urgent = van.usable < (van.booked ?? 0) || van.usable < need.minimum ? 0 : 1;
    withNeed.push({ van, need, urgent, fill: van.usable / need.target });
  }
  withNeed.sort(
    (a, b) =>
      a.urgent - b.urgent ||
      a.fill - b.fill ||
      a.van.locationId - b.van.locationId ||
      a.van.productId - b.van.productId,
  );
  return withNeed.map(({ van: v, need }) => {
    const wanted = need.target - v.usable;
    const allocations: Allocation[] = [];
    let left = Math.max(0, wanted);
    for (const b of remaining.get(v.productId) ?? []) {
      if (left === 0) break;
      if (b.quantity <= 0) continue;
      const take = Math.min(left, b.quantity);
      allocations.push({ batchId: b.batchId, lotNumber: b.lotNumber, expiresOn: b.expiresOn, quantity: take });
      b.quantity -= take;
      left -= take;
    }
    return {
      locationId: v.locationId,
      productId: v.productId,
      usable: v.usable,
      par: v.par ?? { minimum: 0, target: 0 },
      booked: v.booked ?? 0,
      need,
      wanted,
      allocations,
      shortfall: left,
    };
  });
}

export interface ReorderLine {
  productId: number;
  /** Usable at the depot once the planned transfers have gone. */
  usableAfterTransfers: number;
  par: ParLevel;
  orderQuantity: number;
  /** Packs used across the firm in the last 90 days. */
  used90Days: number;
  /** Days the depot's stock lasts at that rate; null when nothing was used. */
  daysOfCover: number | null;
}

/** Products where the depot, after the restock run, is below its minimum: order back up to target. */
export function planReorder(
  products: { productId: number; depotBatches: BatchStock[]; par: ParLevel | null; used90Days: number }[],
  restock: RestockLine[],
  today: CalendarDate,
): ReorderLine[] {
  const planned = new Map<number, number>();
  for (const line of restock)
    planned.set(
      line.productId,
      (planned.get(line.productId) ?? 0) + line.allocations.reduce((n, a) => n + a.quantity, 0),
    );
  const lines: ReorderLine[] = [];
  for (const p of products) {
    if (!p.par) continue;
    const after = usableQuantity(p.depotBatches, today) - (planned.get(p.productId) ?? 0);
    if (after >= p.par.minimum) continue;
    const perDay = p.used90Days / 90;
    lines.push({
      productId: p.productId,
      usableAfterTransfers: after,
      par: p.par,
      orderQuantity: p.par.target - after,
      used90Days: p.used90Days,
      daysOfCover: perDay > 0 ? Math.floor(Math.max(0, after) / perDay) : null,
    });
  }
  return lines;
}
