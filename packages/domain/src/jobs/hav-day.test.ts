import { describe, expect, it } from 'vitest';
import { agitationPoints, havDayPointsIfSaved } from './hav-day.ts';

// HSE points system (Control of Vibration at Work Regulations 2005): points = 2 x a^2 x hours.
describe('one agitation on the vibration day', () => {
  it('counts 2 x a^2 x hours, to one decimal place', () => {
    // HSE's example: 10 m/s^2 for 30 minutes is 100 points.
    expect(agitationPoints(10, 30)).toBe(100);
    // 6.5 m/s^2 for 5 minutes: 2 x 42.25 x 5/60 = 7.0417 -> 7.
    expect(agitationPoints(6.5, 5)).toBe(7);
    // 3.2 m/s^2 for 7 minutes: 2 x 10.24 x 7/60 = 2.3893 -> 2.4.
    expect(agitationPoints(3.2, 7)).toBe(2.4);
  });

  it('counts nothing without a magnitude or without time', () => {
    expect(agitationPoints(null, 30)).toBe(0);
    expect(agitationPoints(0, 30)).toBe(0);
    expect(agitationPoints(10, 0)).toBe(0);
  });

  it('replaces the radiator\u2019s saved points in the day\u2019s total', () => {
    expect(havDayPointsIfSaved(107, 7, 2.4)).toBe(102.4);
    expect(havDayPointsIfSaved(0.3, 0.1, 0.2)).toBe(0.4);
  });
});
