import { describe, expect, it } from 'vitest';
import { addDays, addMonths, calendarDateIn, calendarDateSchema, daysBetween } from './calendar-date.ts';

describe('calendar dates', () => {
  it('adds days across month and year ends', () => {
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2027-03-01', -1)).toBe('2027-02-28');
    expect(daysBetween('2026-12-01', '2027-12-01')).toBe(365);
  });

  // UK clocks go back at 01:00 UTC on the last Sunday of October (The Summer Time Order 2002):
  // on 2026-10-25 British Summer Time ends.
  it('finds the London calendar day of an instant either side of the clock change', () => {
    expect(calendarDateIn(new Date('2026-10-24T23:30:00Z'), 'Europe/London')).toBe('2026-10-25');
    expect(calendarDateIn(new Date('2026-10-25T23:30:00Z'), 'Europe/London')).toBe('2026-10-25');
    expect(calendarDateIn(new Date('2026-06-30T23:30:00Z'), 'Europe/London')).toBe('2026-07-01');
  });

  it('refuses dates that do not exist', () => {
    expect(calendarDateSchema.safeParse('2026-02-30').success).toBe(false);
    expect(calendarDateSchema.safeParse('2028-02-29').success).toBe(true);
    expect(calendarDateSchema.safeParse('01/12/2026').success).toBe(false);
  });

  // Calendar months, as a person counts them: a year on from 29 February 2028 is 28 February 2029.
  it('adds calendar months, falling back to the last day of a shorter month', () => {
    expect(addMonths('2026-12-02', 12)).toBe('2027-12-02');
    expect(addMonths('2027-01-31', 1)).toBe('2027-02-28');
    expect(addMonths('2028-02-29', 12)).toBe('2029-02-28');
    expect(addMonths('2026-11-30', 3)).toBe('2027-02-28');
  });
});
