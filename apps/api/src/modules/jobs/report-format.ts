/**
 * Dates, times and quantities as the reports print them. Dates follow the GOV.UK style guide's "Dates"
 * entry, as it is commonly quoted ("use 3 December 2026": day, month in words, year; no comma, no "th");
 * times are on the 24-hour clock. Both are shown in the firm's time zone.
 */

const dayFormats = new Map<string, Intl.DateTimeFormat>();
const timeFormats = new Map<string, Intl.DateTimeFormat>();

function cached(cache: Map<string, Intl.DateTimeFormat>, timeZone: string, options: Intl.DateTimeFormatOptions) {
  let f = cache.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', { timeZone, ...options });
    cache.set(timeZone, f);
  }
  return f;
}

/** "3 December 2026": the day an instant falls on in the firm's zone. */
export function ukDate(instant: string | Date, timeZone: string): string {
  return cached(dayFormats, timeZone, { day: 'numeric', month: 'long', year: 'numeric' }).format(new Date(instant));
}

/** "3 December 2026" from a calendar date ("2026-12-03"), which has no zone of its own. */
export function ukCalendarDate(date: string): string {
  const [y, m, d] = date.split('-').map(Number);
  if (!y || !m || !d) return date;
  return ukDate(new Date(Date.UTC(y, m - 1, d, 12)), 'UTC');
}

/** "14:05" in the firm's zone. */
export function ukTime(instant: string | Date, timeZone: string): string {
  return cached(timeFormats, timeZone, { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(
    new Date(instant),
  );
}

/** "3 December 2026 at 14:05". */
export function ukDateTime(instant: string | Date, timeZone: string): string {
  return `${ukDate(instant, timeZone)} at ${ukTime(instant, timeZone)}`;
}

/** A pack size in the unit a label uses: "500 ml", "1 litre", "2.5 litres". */
export function packSize(ml: number): string {
  if (ml < 1000) return `${ml} ml`;
  const litres = ml / 1000;
  return `${Number.isInteger(litres) ? litres : litres.toFixed(1)} ${litres === 1 ? 'litre' : 'litres'}`;
}

export const yesNo = (b: boolean | null | undefined, unknown = 'Not recorded') =>
  b === true ? 'Yes' : b === false ? 'No' : unknown;

/** One decimal, or "-" for a figure not taken. */
export const one = (n: number | null | undefined) => (n === null || n === undefined ? '-' : n.toFixed(1));
