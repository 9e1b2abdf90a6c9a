import { addDays, type CalendarDate } from '@heatfleet/domain';
import type { Knex } from 'knex';
import { startOfDayIn } from '../overview/overview-service.ts';
import { sumUsedByProductSince } from './stock-ledger-dal.ts';

type Db = Knex | Knex.Transaction;

/** Days of use the reorder list's days of cover are worked from: today and the 89 days before it. */
export const USAGE_DAYS = 90;

/**
 * Packs used on the days already over, per firm, zone and first day. A 'used' movement is written at
 * the moment of use and never edited (a reversal is a row of its own kind), so those days' sum cannot
 * change: read once per process and day, then only today's movements are read (the 90 days were
 * 140,000 rows of the large bench firm on every restock run). Bounded, as a cache must be.
 */
const closedDays = new Map<string, Map<number, number>>();
const CLOSED_DAYS_MAX = 10_000;

/** Packs of each product used today and on the 89 days before it, in the firm's zone. */
export async function packsUsedLast90Days(
  db: Db,
  firmId: number,
  timeZone: string,
  today: CalendarDate,
): Promise<Map<number, number>> {
  const from = startOfDayIn(addDays(today, -(USAGE_DAYS - 1)), timeZone);
  const todayStart = startOfDayIn(today, timeZone);
  const key = `${firmId}|${timeZone}|${today}`;
  let closed = closedDays.get(key);
  const [earlier, todays] = await Promise.all([
    closed ? Promise.resolve(null) : sumUsedByProductSince(db, firmId, from, todayStart),
    sumUsedByProductSince(db, firmId, todayStart),
  ]);
  if (!closed) {
    closed = new Map((earlier ?? []).map((u) => [u.product_id, -Number(u.n)]));
    if (closedDays.size >= CLOSED_DAYS_MAX) closedDays.clear();
    closedDays.set(key, closed);
  }
  const used = new Map(closed);
  for (const u of todays) used.set(u.product_id, (used.get(u.product_id) ?? 0) - Number(u.n));
  return used;
}
