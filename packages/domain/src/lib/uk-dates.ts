import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';
import { addDays, type CalendarDate } from './calendar-date.ts';

// The one place dates become words (issue 14): everything a person reads shows UK dates ("3 Dec 2026") and
// 24-hour times in the firm's own zone, never ISO days or UTC times. CSVs keep sortable ISO days and times,
// but in the firm's zone, with the zone named in the column header.

type Instant = Date | string;

function inZone(at: Instant, timeZone: string): TZDate {
  return new TZDate(typeof at === 'string' ? Date.parse(at) : at.getTime(), timeZone);
}

/** "3 Dec 2026": the day an instant falls on in the firm's zone. */
export function formatUkDate(at: Instant, timeZone: string): string {
  return format(inZone(at, timeZone), 'd MMM yyyy');
}

/** "3 Dec 2026, 14:05": an instant in the firm's zone, on the 24-hour clock. */
export function formatUkDateTime(at: Instant, timeZone: string): string {
  return format(inZone(at, timeZone), 'd MMM yyyy, HH:mm');
}

/** "14:05" in the firm's zone. */
export function formatUkTime(at: Instant, timeZone: string): string {
  return format(inZone(at, timeZone), 'HH:mm');
}

/** "3 Dec 2026" for a calendar day ('YYYY-MM-DD'), which has no zone: due dates, expiries, check dates. */
export function formatUkCalendarDate(day: CalendarDate): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  return format(new Date(y, m - 1, d), 'd MMM yyyy');
}

/**
 * "Dec 2026" for a month ('YYYY-MM'), "December 2026" long, "Dec 26" on a chart's axis. Months have no zone, like
 * calendar days. date-fns rather than `toLocaleDateString`, which builds a new formatter on each call (about 4 ms
 * each on the owner's first page, 12 months twice: README, "Round two").
 */
export function formatUkMonth(month: string, form: 'short' | 'long' | 'axis' = 'short'): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return format(new Date(y, m - 1, 1), form === 'long' ? 'MMMM yyyy' : form === 'axis' ? 'MMM yy' : 'MMM yyyy');
}

/** "2026-12-03 14:05:09": sortable, for a CSV cell, in the firm's zone (name the zone in the column's header). */
export function formatCsvDateTime(at: Instant, timeZone: string): string {
  return format(inZone(at, timeZone), 'yyyy-MM-dd HH:mm:ss');
}

/** The instant the firm's calendar day starts (midnight there, whether GMT or BST). */
export function firmDayStart(day: CalendarDate, timeZone: string): Date {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  return new Date(new TZDate(y, m - 1, d, timeZone).getTime());
}

/** The instant after the firm's calendar day ends: `[firmDayStart(day), firmDayEnd(day))` is the whole day. */
export function firmDayEnd(day: CalendarDate, timeZone: string): Date {
  return firmDayStart(addDays(day, 1), timeZone);
}

/** How a zone is named beside a time a person reads: "UK time" for Europe/London, else the zone's own name. */
export function zoneLabel(timeZone: string): string {
  return timeZone === 'Europe/London' ? 'UK time' : `${timeZone} time`;
}
