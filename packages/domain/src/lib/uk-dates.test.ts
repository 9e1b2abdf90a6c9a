import { describe, expect, it } from 'vitest';
import {
  firmDayEnd,
  firmDayStart,
  formatCsvDateTime,
  formatUkCalendarDate,
  formatUkDate,
  formatUkDateTime,
  formatUkMonth,
  formatUkTime,
  zoneLabel,
} from './uk-dates.ts';

// UK clock changes: British Summer Time runs from 01:00 GMT on the last Sunday of March to 01:00 GMT on the last
// Sunday of October (The Summer Time Act 1972, as amended by the Summer Time Order 2002; GOV.UK "When do the clocks
// change?"). In 2026: 29 March and 25 October. Dates written "3 Dec 2026" as the brief for issue 14 asks.
const LONDON = 'Europe/London';

describe('UK dates in the firm\u2019s zone', () => {
  it('writes a summer evening in UTC as the next day in London (BST, UTC+1)', () => {
    const at = new Date('2026-07-14T23:30:00Z');
    expect(formatUkDate(at, LONDON)).toBe('15 Jul 2026');
    expect(formatUkDateTime(at, LONDON)).toBe('15 Jul 2026, 00:30');
    expect(formatUkTime(at, LONDON)).toBe('00:30');
    expect(formatCsvDateTime(at, LONDON)).toBe('2026-07-15 00:30:00');
  });

  it('keeps a winter instant on the same day (GMT, UTC+0) and writes the 24-hour clock', () => {
    expect(formatUkDateTime('2026-12-03T14:05:00.000Z', LONDON)).toBe('3 Dec 2026, 14:05');
    expect(formatUkDate('2026-12-03T23:59:00Z', LONDON)).toBe('3 Dec 2026');
  });

  it('writes calendar days without moving them, whatever the zone of the machine', () => {
    expect(formatUkCalendarDate('2026-12-03')).toBe('3 Dec 2026');
    expect(formatUkCalendarDate('2027-01-01')).toBe('1 Jan 2027');
    expect(formatUkCalendarDate('2026-03-29')).toBe('29 Mar 2026');
  });

  it('writes months as the brief writes dates: "Dec 2026", "December 2026", and "Dec 26" on a chart', () => {
    expect(formatUkMonth('2026-12')).toBe('Dec 2026');
    expect(formatUkMonth('2027-01', 'long')).toBe('January 2027');
    expect(formatUkMonth('2026-03', 'axis')).toBe('Mar 26');
    expect(formatUkMonth('2026-10', 'short')).toBe('Oct 2026');
  });

  it('starts the firm\u2019s day at local midnight: 23:00 UTC the evening before in summer, 00:00 UTC in winter', () => {
    expect(firmDayStart('2026-07-15', LONDON).toISOString()).toBe('2026-07-14T23:00:00.000Z');
    expect(firmDayEnd('2026-07-15', LONDON).toISOString()).toBe('2026-07-15T23:00:00.000Z');
    expect(firmDayStart('2026-12-03', LONDON).toISOString()).toBe('2026-12-03T00:00:00.000Z');
    // The day the clocks go forward is 23 hours long; the day they go back, 25.
    expect(firmDayEnd('2026-03-29', LONDON).getTime() - firmDayStart('2026-03-29', LONDON).getTime()).toBe(23 * 3600e3);
    expect(firmDayEnd('2026-10-25', LONDON).getTime() - firmDayStart('2026-10-25', LONDON).getTime()).toBe(25 * 3600e3);
  });

  it('names London as UK time and any other zone by its name', () => {
    expect(zoneLabel(LONDON)).toBe('UK time');
    expect(zoneLabel('Europe/Dublin')).toBe('Europe/Dublin time');
  });

  it('follows another zone when the firm has one', () => {
    expect(formatUkDateTime('2026-12-03T14:05:00Z', 'Europe/Dublin')).toBe('3 Dec 2026, 14:05');
    expect(firmDayStart('2026-12-03', 'Europe/Paris').toISOString()).toBe('2026-12-02T23:00:00.000Z');
  });
});
