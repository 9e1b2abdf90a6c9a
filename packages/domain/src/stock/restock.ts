import type { CalendarDate } from '../lib/calendar-date.ts';
import { allocateFefo, usableQuantity, type Allocation, type BatchStock } from './fefo.ts';

export interface ParLevel {
  minimum: number;
  target: number;
}

export interface VanNeed {
  locationId: number;
  productId: number;
  /** Usable packs on the van now (expired batches do not count). */
  usable: number;
  par: ParLevel;
}

export interface RestockLine {
  locationId: number;
  productId: number;
  usable: number;
  par: ParLevel;
  wanted: number;
  allocations: Allocation[];
  shortfall: number;
}

/**
 * The restock run: every van below its target gets what brings it to target, taken from the
 * depot's batches first expiry first, while the depot lasts. Vans below their minimum are served
 * first (then the lowest relative to target, then by id), so scarce stock goes where it is needed.
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
  const urgency = (v: VanNeed) => (v.usable < v.par.minimum ? 0 : 1);
  const order = vans
    .filter((v) => v.usable < v.par.target)
    .sort(
      (a, b) =>
        urgency(a) - urgency(b) ||
        a.usable / a.par.target - b.usable / b.par.target ||
        a.locationId - b.locationId ||
        a.productId - b.productId,
    );
  return order.map((v) => {
    const wanted = v.par.target - v.usable;
    const stock = remaining.get(v.productId) ?? [];
    const { allocations, shortfall } = allocateFefo(stock, wanted, today);
    for (const a of allocations) stock.find((b) => b.batchId === a.batchId)!.quantity -= a.quantity;
    return {
      locationId: v.locationId,
      productId: v.productId,
      usable: v.usable,
      par: v.par,
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
