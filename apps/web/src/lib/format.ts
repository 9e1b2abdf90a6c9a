const dateFormats = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string, withTime: boolean): Intl.DateTimeFormat {
  const key = `${timeZone}|${withTime}`;
  let format = dateFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', {
      dateStyle: 'medium',
      ...(withTime ? { timeStyle: 'short' } : {}),
      timeZone,
    });
    dateFormats.set(key, format);
  }
  return format;
}

/** Dates show in the firm's own time zone, so a job at 23:30 in London is not filed under tomorrow. */
export function formatDate(iso: string, timeZone: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : formatter(timeZone, false).format(date);
}

export function formatDateTime(iso: string, timeZone: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : formatter(timeZone, true).format(date);
}

/**
 * Due dates are calendar days ('YYYY-MM-DD') with no zone; formatting them in UTC keeps the day as
 * written whatever zone the phone is in.
 */
export function formatCalendarDate(date: string): string {
  return formatDate(`${date}T00:00:00Z`, 'UTC');
}
