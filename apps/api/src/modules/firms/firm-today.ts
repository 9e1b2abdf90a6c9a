import { calendarDateIn, DEFAULT_TIME_ZONE } from '@heatfleet/domain';
import type { Knex } from 'knex';
import { findFirm } from './firm-dal.ts';

/** The firm's calendar day now, in its own time zone (due dates are calendar days: DEVELOPERS.md). */
export async function firmToday(db: Knex | Knex.Transaction, firmId: number, now: Date): Promise<string> {
  const firm = await findFirm(db, firmId);
  return calendarDateIn(now, firm?.time_zone ?? DEFAULT_TIME_ZONE);
}
