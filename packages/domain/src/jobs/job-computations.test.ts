import { describe, expect, it } from 'vitest';
import { dosePlan } from './dose-plan.ts';
import {
  boreLitresPerMetre,
  pipeWaterContentLitresPerMetre,
  quickEstimateLitres,
  radiatorLitres,
  singlePanelEquivalents,
  systemVolumeLitres,
} from './system-volume.ts';
import {
  coldBottom,
  flushComplete,
  inhibitorCheck,
  meanWaterToRoomKelvin,
  radiatorOutputFactor,
  radiatorOutputWatts,
  vibrationPoints,
  vibrationStatus,
} from './water-tests.ts';

describe('pipe water content (EN 1057 copper: OD minus two walls; L/m = pi/4 x ID^2 / 1000)', () => {
  it.each([
    ['8', 0.0363],
    ['10', 0.0581],
    ['15', 0.1453],
    ['22', 0.3205],
    ['28', 0.5391],
  ] as const)('%s mm gives %s L/m', (tube, expected) => {
    expect(pipeWaterContentLitresPerMetre(tube)).toBeCloseTo(expected, 4);
  });
  it('a plastic pipe by its bore', () => {
    expect(boreLitresPerMetre(13.6)).toBeCloseTo(0.1453, 4);
  });
});

describe('system volume', () => {
  it('radiators scale with length and height (about 3 L/m single, 6 L/m double at 600 mm: from memory)', () => {
    expect(radiatorLitres('single', 600, 1000)).toBeCloseTo(3, 6);
    expect(radiatorLitres('double', 600, 1200)).toBeCloseTo(7.2, 6);
    expect(radiatorLitres('double', 300, 1000)).toBeCloseTo(3, 6);
  });
  it('the quick estimate: about 10 L per single-panel equivalent, a double counting as two (common trade practice)', () => {
    expect(singlePanelEquivalents(['single', 'double', 'double_fins', 'towel_rail'])).toBe(6);
    expect(quickEstimateLitres(['single', 'double', 'double_fins', 'towel_rail'])).toBe(60);
  });
  it('is the sum of its parts', () => {
    expect(
      systemVolumeLitres({
        radiatorsLitres: 48.5,
        pipeworkLitres: 12.25,
        heatExchangerLitres: 1.5,
        cylinderCoilLitres: 4,
        otherLitres: 0.75,
      }),
    ).toBeCloseTo(67, 9);
  });
});

describe('dose plan (litres = volume x rate / 100, whole packs; packs per radiators; the larger wins)', () => {
  const rule = { packSizeMl: 1000, doseLitresPer100L: 1, radiatorsPerPack: 10 };
  it('18 radiators need 2 packs by the rule of thumb (about one pack per 10 radiators: common trade practice)', () => {
    expect(dosePlan(100, 18, rule)).toEqual({
      litres: 1,
      packsByVolume: 1,
      packsByRadiators: 2,
      packs: 2,
      decidedBy: 'radiators',
    });
  });
  it('volume wins when larger; rounding is up to whole packs', () => {
    expect(dosePlan(250, 8, rule)).toEqual({
      litres: 2.5,
      packsByVolume: 3,
      packsByRadiators: 1,
      packs: 3,
      decidedBy: 'volume',
    });
  });
  it('exactly two packs stay two packs', () => {
    expect(dosePlan(200, 0, { ...rule, radiatorsPerPack: null }).packs).toBe(2);
    expect(dosePlan(100, 0, { packSizeMl: 500, doseLitresPer100L: 1, radiatorsPerPack: null }).packs).toBe(2);
  });
});

describe('radiator output at the measured temperatures (EN 442: rated x (dT/50)^n, n = 1.3)', () => {
  it('75/65/20 is the rating point, dT 50 K', () => {
    expect(meanWaterToRoomKelvin(75, 65, 20)).toBe(50);
    expect(radiatorOutputFactor(50)).toBe(1);
  });
  it.each([
    [30, 0.5148],
    [60, 1.2675],
  ])('factor at dT %s K is %s', (dt, factor) => {
    expect(radiatorOutputFactor(dt)).toBeCloseTo(factor, 4);
  });
  it('a 1000 W radiator at 55/45/20 (dT 30 K) gives about 515 W', () => {
    expect(radiatorOutputWatts(1000, meanWaterToRoomKelvin(55, 45, 20))).toBeCloseTo(514.8, 1);
  });
  it('flags a cold bottom above the threshold (common practice (no source))', () => {
    expect(coldBottom(62, 48, 10)).toBe(true);
    expect(coldBottom(62, 55, 10)).toBe(false);
  });
});

describe('water tests', () => {
  // BS 7593 guidance as commonly quoted (the standard's own text was not seen): within 10% of mains TDS, water clear.
  it('flush complete within 10% of mains TDS and clear', () => {
    expect(flushComplete(200, 219, true).complete).toBe(true);
    expect(flushComplete(200, 221, true).complete).toBe(false);
    expect(flushComplete(200, 205, false).complete).toBe(false);
  });
  it('inhibitor against its target range', () => {
    expect(inhibitorCheck(1.2, { min: 1, max: 1.5 })).toBe('pass');
    expect(inhibitorCheck(0.6, { min: 1, max: 1.5 })).toBe('low');
    expect(inhibitorCheck(1.6, { min: 1, max: 1.5 })).toBe('high');
  });
});

describe('hand-arm vibration (HSE points: 2 x a^2 x hours; 100 action, 400 limit)', () => {
  it.each([
    [10, 0.5, 100],
    [5, 3, 150],
    [2.5, 8, 100],
    [5, 8, 400],
  ])('%s m/s^2 for %s h is %s points', (a, h, points) => {
    expect(vibrationPoints(a, h)).toBeCloseTo(points, 9);
  });
  it('A(8) 2.5 m/s^2 is the action value and 5 m/s^2 the limit', () => {
    expect(vibrationStatus(vibrationPoints(2.5, 8))).toBe('above_action');
    expect(vibrationStatus(vibrationPoints(5, 8))).toBe('above_action');
    expect(vibrationStatus(vibrationPoints(5, 8.1))).toBe('above_limit');
    expect(vibrationStatus(99)).toBe('below_action');
  });
});
