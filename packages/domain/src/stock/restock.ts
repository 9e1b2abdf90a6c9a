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
  const remaining = new Map<number, BatchStock[]>();
  for (const [productId, batches] of depotBatches)
    remaining.set(
      productId,
      batches.map((b) => ({ ...b })),
    );
  const withNeed = vans.flatMap((v) => {
    const need = stockNeedOf(v.par, v.booked ?? 0);
    return need && v.usable < need.target ? [{ ...v, need }] : [];
  });
  const urgency = (v: (typeof withNeed)[number]) => (v.usable < (v.booked ?? 0) || v.usable < v.need.minimum ? 0 : 1);
  const order = withNeed.sort(
    (a, b) =>
      urgency(a) - urgency(b) ||
      a.usable / a.need.target - b.usable / b.need.target ||
      a.locationId - b.locationId ||
      a.productId - b.productId,
  );
  return order.map((v) => {
    const wanted = v.need.target - v.usable;
    const stock = remaining.get(v.productId) ?? [];
    const { allocations, shortfall } = allocateFefo(stock, wanted, today);
    for (const a of allocations) stock.find((b) => b.batchId === a.batchId)!.quantity -= a.quantity;
    return {
      locationId: v.locationId,
      productId: v.productId,
      usable: v.usable,
      par: v.par ?? { minimum: 0, target: 0 },
      booked: v.booked ?? 0,
      need: v.need,
      wanted,
      allocations,
      shortfall,
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
