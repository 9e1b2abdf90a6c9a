import { describe, expect, it } from 'vitest';
import { havRegister, havRegisterQuerySchema, weekStartOf } from './hav-register.ts';

// Worked figures from HSE's points system ready-reckoner (INDG175 and L140, from memory): a tool of
// 5 m/s² scores 50 points an hour, 10 m/s² 200 points an hour (points = 2 x a² x hours); 100 points a day is
// the exposure action value (2.5 m/s² A(8)), 400 the exposure limit value (5 m/s² A(8)) of the Control of
// Vibration at Work Regulations 2005. Health surveillance is for those likely to be exposed at or above the
// action value (regulation 7).

const engineers = [
  { memberId: 1, name: 'Ash' },
  { memberId: 2, name: 'Bea' },
  { memberId: 3, name: 'Cal' },
];

describe('weekStartOf', () => {
  it('runs weeks Monday to Sunday: Thursday 3 December 2026 is in the week of Monday 30 November', () => {
    expect(weekStartOf('2026-12-03')).toBe('2026-11-30');
    expect(weekStartOf('2026-11-30')).toBe('2026-11-30');
    expect(weekStartOf('2026-12-06')).toBe('2026-11-30');
  });
});

describe('havRegister', () => {
  const register = havRegister({
    to: '2026-12-03',
    weeks: 2,
    engineers,
    agitations: [
      // Ash: 5 m/s² for 2 hours in two spells on Tuesday 1 December = 100 points, exactly the action value.
      { memberId: 1, day: '2026-12-01', magnitudeMs2: 5, minutes: 60 },
      { memberId: 1, day: '2026-12-01', magnitudeMs2: 5, minutes: 60 },
      // Ash: 5 m/s² for 1 hour on Wednesday 25 November = 50 points.
      { memberId: 1, day: '2026-11-25', magnitudeMs2: 5, minutes: 60 },
      // Bea: 10 m/s² for 2.5 hours = 500 points, over the limit value.
      { memberId: 2, day: '2026-11-24', magnitudeMs2: 10, minutes: 150 },
      // Cal: 5 m/s² for 90 minutes = 75 points; and a tool with no figure, which scores nothing.
      { memberId: 3, day: '2026-12-02', magnitudeMs2: 5, minutes: 90 },
      { memberId: 3, day: '2026-12-02', magnitudeMs2: null, minutes: 60 },
      // Outside the two weeks (Sunday 22 November): not counted.
      { memberId: 3, day: '2026-11-22', magnitudeMs2: 10, minutes: 600 },
    ],
  });

  it('covers whole weeks, Monday 23 November to Sunday 6 December', () => {
    expect(register).toMatchObject({ from: '2026-11-23', to: '2026-12-06', weekStarts: ['2026-11-23', '2026-11-30'] });
    expect(register).toMatchObject({ actionPoints: 100, limitPoints: 400 });
  });

  it('flags over the limit first, then the action value, then those clear', () => {
    expect(register.engineers.map((e) => [e.name, e.surveillance])).toEqual([
      ['Bea', 'over_limit'],
      ['Ash', 'needed'],
      ['Cal', 'not_indicated'],
    ]);
  });

  it('adds a day’s spells together: 100 points is at the action value, so surveillance is needed', () => {
    const ash = register.engineers.find((e) => e.name === 'Ash')!;
    expect(ash.weeks).toEqual([
      {
        weekStart: '2026-11-23',
        days: [{ day: '2026-11-25', points: 50 }],
        highestDayPoints: 50,
        daysOverAction: 0,
        daysOverLimit: 0,
      },
      {
        weekStart: '2026-11-30',
        days: [{ day: '2026-12-01', points: 100 }],
        highestDayPoints: 100,
        daysOverAction: 1,
        daysOverLimit: 0,
      },
    ]);
    expect(ash).toMatchObject({ daysRecorded: 2, daysOverAction: 1, daysOverLimit: 0, highestDayPoints: 100 });
    expect(ash.reason).toContain('health surveillance needed (regulation 7)');
  });

  it('500 points in a day is over the limit value, and counts as over the action value too', () => {
    const bea = register.engineers.find((e) => e.name === 'Bea')!;
    expect(bea).toMatchObject({ daysOverAction: 1, daysOverLimit: 1, highestDayPoints: 500 });
  });

  it('75 points is under the action value; a tool with no figure and a day outside the weeks add nothing', () => {
    const cal = register.engineers.find((e) => e.name === 'Cal')!;
    expect(cal).toMatchObject({ daysRecorded: 1, daysOverAction: 0, highestDayPoints: 75 });
    expect(cal.reason).toBe('Every day under 100 points (highest 75).');
  });
});

describe('havRegisterQuerySchema', () => {
  it('shows 12 weeks unless told, at most 52', () => {
    expect(havRegisterQuerySchema.parse({}).weeks).toBe(12);
    expect(havRegisterQuerySchema.safeParse({ weeks: '53' }).error?.issues[0]?.message).toBe('Show at most 52 weeks.');
  });
});
