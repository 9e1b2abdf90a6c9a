import { describe, expect, it } from 'vitest';
import { circulationClock, circulationMinimumMinutes } from './circulation.ts';

// The minimum hot circulation time is the cleaner's own, from its label (common practice (no source)).
describe('hot circulation of the cleaner', () => {
  const dosed = new Date('2026-03-02T09:00:00Z');

  it('takes the longest minimum of the cleaners on the job, and ignores other products', () => {
    expect(
      circulationMinimumMinutes([
        { kind: 'cleaner', minCirculationMinutes: 30 },
        { kind: 'cleaner', minCirculationMinutes: 60 },
        { kind: 'inhibitor', minCirculationMinutes: 90 },
      ]),
    ).toBe(60);
    expect(circulationMinimumMinutes([{ kind: 'cleaner', minCirculationMinutes: null }])).toBeNull();
    expect(circulationMinimumMinutes([])).toBeNull();
  });

  it('has not started until the cleaner is dosed', () => {
    expect(circulationClock(60, null, null, dosed)).toEqual({
      minimumMinutes: 60,
      startedAt: null,
      elapsedMinutes: null,
      met: false,
    });
    expect(circulationClock(null, null, null, dosed).met).toBeNull();
  });

  it('counts whole minutes to now while running, and to the tick once stopped', () => {
    expect(circulationClock(60, dosed, null, new Date('2026-03-02T09:59:59Z'))).toMatchObject({
      elapsedMinutes: 59,
      met: false,
      startedAt: '2026-03-02T09:00:00.000Z',
    });
    expect(circulationClock(60, dosed, null, new Date('2026-03-02T10:00:00Z'))).toMatchObject({
      elapsedMinutes: 60,
      met: true,
    });
    expect(
      circulationClock(60, dosed, new Date('2026-03-02T09:45:00Z'), new Date('2026-03-02T12:00:00Z')),
    ).toMatchObject({ elapsedMinutes: 45, met: false });
  });

  it('never counts below zero when the stop was ticked before the dose', () => {
    expect(circulationClock(null, dosed, new Date('2026-03-02T08:00:00Z'), dosed)).toMatchObject({
      elapsedMinutes: 0,
      met: null,
    });
  });
});
