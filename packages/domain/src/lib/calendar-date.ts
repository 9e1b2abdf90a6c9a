import { z } from 'zod';
import { DATE_REQUIRED } from './zod-messages.ts';

/** A calendar day as 'YYYY-MM-DD', with no time or zone: due dates are days, not instants. */
export type CalendarDate = string;

export const calendarDateSchema = z
  .string({ error: DATE_REQUIRED })
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: (iss) => `"${String(iss.input)}" is not a date (use YYYY-MM-DD).` })
  .refine(
    (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
    {
      error: (iss) => `"${String(iss.input)}" is not a real date.`,
    },
  );

const DAY_MS = 86_400_000;

export function addDays(date: CalendarDate, days: number): CalendarDate {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: CalendarDate, to: CalendarDate): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);
}

/** The calendar day an instant falls on in a time zone (Intl, so it follows clock changes). */
export function calendarDateIn(instant: Date, timeZone: string): CalendarDate {
  const parts = new Intl.DateTimeFormat('en-CA', {
    timeZone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).formatToParts(instant);
  const get = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${get('year')}-${get('month')}-${get('day')}`;
}

/**
 * The same day `months` later; a day the target month lacks falls back to its last day
 * (31 January + 1 month is 28 or 29 February), as a year on from 29 February is 28 February.
 */
export function addMonths(date: CalendarDate, months: number): CalendarDate {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  const monthIndex = y * 12 + (m - 1) + months;
  const year = Math.floor(monthIndex / 12);
  const month = (monthIndex % 12) + 1;
  const lastDay = new Date(Date.UTC(year, month, 0)).getUTCDate();
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(Math.min(d, lastDay)).padStart(2, '0')}`;
}

/**
 * A calendar date within a range that makes sense for what it is. Years 0000-0999 or 9999 are typing
 * slips, and a date that far out would sort, remind and print wrongly everywhere it is used.
 * `notAfterToday` refuses dates that have not happened yet (a day's slack covers time zones).
 */
export function calendarDateWithin(
  label: string,
  range: { from: CalendarDate; to: CalendarDate; notAfterToday?: boolean },
) {
  const readable = (d: CalendarDate) =>
    new Date(`${d}T00:00:00Z`).toLocaleDateString('en-GB', {
      timeZone: 'UTC',
      day: 'numeric',
      month: 'long',
      year: 'numeric',
    });
  return calendarDateSchema
    .refine((d) => d >= range.from && d <= range.to, {
      error: (iss) =>
        `${label} must be between ${readable(range.from)} and ${readable(range.to)} (you gave ${String(iss.input)}).`,
    })
    .refine((d) => !range.notAfterToday || d <= addDays(new Date().toISOString().slice(0, 10), 1), {
      error: `${label} cannot be in the future.`,
    });
}

/** The ranges the app accepts, one per kind of date (common practice (no source): wide enough for real records). */
export const dateRanges = {
  /** Bookings, due dates, expiries and checks: this century. */
  planned: { from: '2000-01-01', to: '2099-12-31' },
  /** When a tool went into service: from 1970, and not in the future. */
  inService: { from: '1970-01-01', to: '2099-12-31', notAfterToday: true },
  /**
   * Something already done (an inspection, a check): from 2000. Its service refuses a day after
   * today in the firm's own time zone, with its own message, so the upper bound here is only a backstop.
   */
  done: { from: '2000-01-01', to: '9999-12-31' },
} as const;
