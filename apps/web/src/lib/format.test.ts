import { describe, expect, it } from 'vitest';
import { formatCalendarDate, formatDate, formatDateTime } from './format';

// UK clock changes: British Summer Time (UTC+1) runs from 01:00 UTC on the last Sunday of March to 01:00 UTC on
// the last Sunday of October (The Summer Time Order 2002, SI 2002/262). In 2026: 29 March and 25 October.
describe('dates in the firm\u2019s time zone', () => {
  it('a job at 23:30 UTC in July is the next day in London (BST), the same day in January (GMT)', () => {
    expect(formatDate('2026-07-14T23:30:00Z', 'Europe/London')).toBe('15 Jul 2026');
    expect(formatDate('2026-01-14T23:30:00Z', 'Europe/London')).toBe('14 Jan 2026');
  });

  it('shows the wall-clock time either side of the spring change', () => {
    expect(formatDateTime('2026-03-29T00:30:00Z', 'Europe/London')).toBe('29 Mar 2026, 00:30');
    expect(formatDateTime('2026-03-29T01:30:00Z', 'Europe/London')).toBe('29 Mar 2026, 02:30');
  });

  it('a calendar day stays the day written, whatever zone the phone is in', () => {
    expect(formatCalendarDate('2026-12-03')).toBe('3 Dec 2026');
    expect(formatCalendarDate('2028-02-29')).toBe('29 Feb 2028');
  });

  it('something that is not a date is shown as it came rather than as "Invalid Date"', () => {
    expect(formatDate('not a date', 'Europe/London')).toBe('not a date');
  });
});
