import { formatUkCalendarDate, formatUkDate, formatUkDateTime, formatUkMonth } from '@heatfleet/domain';

// Dates become words in one place, the domain's uk-dates (the API's e-mails and PDFs use the same): UK dates and
// 24-hour times in the firm's own zone, so a job at 23:30 in London is not filed under tomorrow.

function isInstant(iso: string): boolean {
  return !Number.isNaN(Date.parse(iso));
}

/** "3 Dec 2026" in the firm's zone; an unreadable value is shown as it came. */
export function formatDate(iso: string, timeZone: string): string {
  return isInstant(iso) ? formatUkDate(iso, timeZone) : iso;
}

/** "3 Dec 2026, 14:05" in the firm's zone. */
export function formatDateTime(iso: string, timeZone: string): string {
  return isInstant(iso) ? formatUkDateTime(iso, timeZone) : iso;
}

/** Calendar days ('YYYY-MM-DD': due dates, expiries) have no zone and show as written. */
export function formatCalendarDate(date: string): string {
  return /^\d{4}-\d{2}-\d{2}$/.test(date) ? formatUkCalendarDate(date) : date;
}

/** "Dec 2026" for a month ('YYYY-MM'); "December 2026" long; "Dec 26" on a chart's axis. */
export function formatMonth(month: string, form: 'short' | 'long' | 'axis' = 'short'): string {
  return /^\d{4}-\d{2}$/.test(month) ? formatUkMonth(month, form) : month;
}
