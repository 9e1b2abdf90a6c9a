const clockFormats = new Map<string, Intl.DateTimeFormat>();

/** A tick's time as HH:MM in the firm's zone: the engineer reads it against the clock on the wall. */
export function formatClock(iso: string, timeZone: string): string {
  let format = clockFormats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone });
    clockFormats.set(timeZone, format);
  }
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : format.format(date);
}

/**
 * A number box as the schema should see it: empty is "not taken" (null), anything else a number,
 * so "abc" reaches the schema as NaN and is refused there in words. A decimal comma is accepted.
 */
export function decimalOrNull(text: string): number | null {
  const trimmed = text.trim();
  return trimmed === '' ? null : Number(trimmed.replace(',', '.'));
}

export function numberText(n: number | null | undefined): string {
  return n == null ? '' : String(n);
}

/** The figure if it is a usable number, for live sums that must not stall on a half-typed box. */
export function finiteOrNull(text: string): number | null {
  const n = decimalOrNull(text);
  return n !== null && Number.isFinite(n) ? n : null;
}
