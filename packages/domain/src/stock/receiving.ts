import { daysBetween, type CalendarDate } from '../lib/calendar-date.ts';

/**
 * Days of use a delivered lot should have left when it is received, unless the product says
 * otherwise: common practice (no source) for stock that has to last through the vans' rotation.
 */
export const DEFAULT_MIN_SHELF_LIFE_DAYS = 90;

export type LotLife = { state: 'expired' } | { state: 'short'; daysLeft: number } | { state: 'ok'; daysLeft: number };

/**
 * Whether a lot may be received: expired (its last day of use has passed: never received, written off
 * instead), short (fewer days left than the product's minimum: only with a confirm), or fine.
 */
export function lotLifeAtReceipt(expiresOn: CalendarDate, today: CalendarDate, minShelfLifeDays: number): LotLife {
  if (expiresOn < today) return { state: 'expired' };
  const daysLeft = daysBetween(today, expiresOn);
  return daysLeft < minShelfLifeDays ? { state: 'short', daysLeft } : { state: 'ok', daysLeft };
}

/**
 * A stocktake difference large enough to ask "are you sure?" before saving: the count drops a
 * held batch to nothing, or moves it by at least 5 packs and by at least half the recorded figure.
 * Common practice (no source): a miscount or a count entered on the wrong line looks like this.
 */
export function isLargeStocktakeChange(recorded: number, counted: number): boolean {
  if (recorded > 0 && counted === 0) return true;
  const diff = Math.abs(counted - recorded);
  return diff >= 5 && diff >= recorded / 2;
}

/** A stocktake that would leave a place that holds stock with none of it (every held batch counted 0). */
export function zeroesWholePlace(held: { batchId: number; quantity: number }[], counted: Map<number, number>): boolean {
  const holding = held.filter((b) => b.quantity > 0);
  return holding.length > 0 && holding.every((b) => counted.get(b.batchId) === 0);
}
