import { z } from 'zod';

/** A calendar day as 'YYYY-MM-DD', with no time or zone: due dates are days, not instants. */
export type CalendarDate = string;

export const calendarDateSchema = z
  .string({ error: 'A date is required.' })
  .trim()
  .regex(/^\d{4}-\d{2}-\d{2}$/, { error: (iss) => `"${String(iss.input)}" is not a date (use YYYY-MM-DD).` })
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), {
    error: (iss) => `"${String(iss.input)}" is not a real date.`,
  });

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
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(instant);
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
