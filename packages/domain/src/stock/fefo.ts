import type { CalendarDate } from '../lib/calendar-date.ts';

export interface BatchStock {
  batchId: number;
  lotNumber: string;
  /** The last day the batch may be used. */
  expiresOn: CalendarDate;
  quantity: number;
}

export interface Allocation {
  batchId: number;
  lotNumber: string;
  expiresOn: CalendarDate;
  quantity: number;
}

/** A batch is usable up to and including its expiry day. */
export function isExpired(batch: Pick<BatchStock, 'expiresOn'>, today: CalendarDate): boolean {
  return batch.expiresOn < today;
}

export function usableQuantity(batches: BatchStock[], today: CalendarDate): number {
  return batches.filter((b) => !isExpired(b, today) && b.quantity > 0).reduce((n, b) => n + b.quantity, 0);
}

/**
 * First expiry, first out: takes `wanted` packs from the usable batches, soonest expiry first
 * (ties by lot number, so the plan is the same every time), never from an expired batch.
 */
export function allocateFefo(
  batches: BatchStock[],
  wanted: number,
  today: CalendarDate,
): { allocations: Allocation[]; shortfall: number } {
  const usable = batches
    .filter((b) => !isExpired(b, today) && b.quantity > 0)
    .sort((a, b) => a.expiresOn.localeCompare(b.expiresOn) || a.lotNumber.localeCompare(b.lotNumber));
  const allocations: Allocation[] = [];
  let left = Math.max(0, wanted);
  for (const b of usable) {
    if (left === 0) break;
    const take = Math.min(left, b.quantity);
    allocations.push({ batchId: b.batchId, lotNumber: b.lotNumber, expiresOn: b.expiresOn, quantity: take });
    left -= take;
  }
  return { allocations, shortfall: left };
}
