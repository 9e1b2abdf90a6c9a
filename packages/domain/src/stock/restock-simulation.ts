import { addDays, type CalendarDate } from '../lib/calendar-date.ts';
import { bookedPacksByVan, jobsWithin, vanProductKey, type BookedJob } from './booked-need.ts';
import type { BatchStock } from './fefo.ts';
import { planReorder, planRestock, type ParLevel } from './restock.ts';

/**
 * A firm's year of jobs replayed day by day against its vans' stock: each week the restock run fills
 * the vans from the depot (par levels alone, or par levels raised for the booked jobs of the next
 * days), the depot orders what the reorder list says (arriving a few days later), and each job takes
 * its packs off its van. A job whose van holds fewer packs than its plan needs of any product
 * "started short". Packs are counted without expiry: every delivery is in date for the year.
 */
export interface RestockSimulationInput {
  /** First and last day replayed (both included). */
  from: CalendarDate;
  to: CalendarDate;
  jobs: BookedJob[];
  vanIds: number[];
  /** Par levels of the vans, keyed by `vanProductKey`. */
  vanPar: Map<string, ParLevel>;
  /** The depot's par level per product (the reorder list orders back to its target). */
  depotPar: Map<number, ParLevel>;
  /** Day of the week the restock run is applied: 0 Sunday ... 1 Monday. */
  restockWeekday: number;
  /** The firm's setting: booked jobs of this many days from the run's day count. */
  restockDays: number;
  /** Days from ordering to the delivery at the depot. */
  deliveryLeadDays: number;
  policy: 'par' | 'booked';
}

export interface RestockSimulationResult {
  jobs: number;
  shortStarts: number;
  shortJobIds: number[];
  packsMoved: number;
  packsOrdered: number;
}

const FAR_EXPIRY = '9999-12-31';

export function simulateRestock(input: RestockSimulationInput): RestockSimulationResult {
  const vanStock = new Map<string, number>();
  for (const [key, par] of input.vanPar) vanStock.set(key, par.target);
  const depot = new Map<number, number>();
  for (const [productId, par] of input.depotPar) depot.set(productId, par.target);
  const deliveries = new Map<CalendarDate, { productId: number; packs: number }[]>();
  const onOrder = new Map<number, number>();
  const jobsByDay = new Map<CalendarDate, BookedJob[]>();
  for (const job of input.jobs) jobsByDay.set(job.scheduledOn, [...(jobsByDay.get(job.scheduledOn) ?? []), job]);
  const productIds = [
    ...new Set([...input.depotPar.keys(), ...input.jobs.flatMap((j) => j.packs.map((p) => p.productId))]),
  ];
  const result: RestockSimulationResult = { jobs: 0, shortStarts: 0, shortJobIds: [], packsMoved: 0, packsOrdered: 0 };

  for (let day = input.from; day <= input.to; day = addDays(day, 1)) {
    for (const d of deliveries.get(day) ?? []) {
      depot.set(d.productId, (depot.get(d.productId) ?? 0) + d.packs);
      onOrder.set(d.productId, (onOrder.get(d.productId) ?? 0) - d.packs);
    }
    if (new Date(`${day}T00:00:00Z`).getUTCDay() === input.restockWeekday) {
      const booked =
        input.policy === 'booked'
          ? bookedPacksByVan(jobsWithin(input.jobs, day, input.restockDays))
          : new Map<string, number>();
      const needs = input.vanIds.flatMap((vanId) =>
        productIds.map((productId) => {
          const key = vanProductKey(vanId, productId);
          return {
            locationId: vanId,
            productId,
            usable: vanStock.get(key) ?? 0,
            par: input.vanPar.get(key) ?? null,
            booked: booked.get(key) ?? 0,
          };
        }),
      );
      const batchesOf = (n: Map<number, number>) =>
        new Map<number, BatchStock[]>(
          productIds.map((p) => [
            p,
            [{ batchId: p, lotNumber: `P${p}`, expiresOn: FAR_EXPIRY, quantity: n.get(p) ?? 0 }],
          ]),
        );
      const lines = planRestock(needs, batchesOf(depot), day);
      for (const line of lines) {
        const packs = line.allocations.reduce((n, a) => n + a.quantity, 0);
        const key = vanProductKey(line.locationId, line.productId);
        vanStock.set(key, (vanStock.get(key) ?? 0) + packs);
        depot.set(line.productId, (depot.get(line.productId) ?? 0) - packs);
        result.packsMoved += packs;
      }
      // What is already on order counts as on hand, so a late delivery is not ordered twice.
      const withOrders = new Map(productIds.map((p) => [p, (depot.get(p) ?? 0) + (onOrder.get(p) ?? 0)]));
      const reorder = planReorder(
        productIds.map((p) => ({
          productId: p,
          depotBatches: batchesOf(withOrders).get(p)!,
          par: input.depotPar.get(p) ?? null,
          used90Days: 0,
        })),
        [],
        day,
      );
      const arrives = addDays(day, input.deliveryLeadDays);
      for (const r of reorder) {
        if (r.orderQuantity <= 0) continue;
        deliveries.set(arrives, [
          ...(deliveries.get(arrives) ?? []),
          { productId: r.productId, packs: r.orderQuantity },
        ]);
        onOrder.set(r.productId, (onOrder.get(r.productId) ?? 0) + r.orderQuantity);
        result.packsOrdered += r.orderQuantity;
      }
    }
    for (const job of [...(jobsByDay.get(day) ?? [])].sort((a, b) => a.jobId - b.jobId)) {
      result.jobs += 1;
      let short = false;
      for (const p of job.packs) {
        const key = vanProductKey(job.vanId, p.productId);
        const have = vanStock.get(key) ?? 0;
        if (have < p.packs) short = true;
        vanStock.set(key, have - Math.min(have, p.packs));
      }
      if (short) {
        result.shortStarts += 1;
        result.shortJobIds.push(job.jobId);
      }
    }
  }
  return result;
}
