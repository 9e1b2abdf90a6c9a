import { describe, expect, it } from 'vitest';
import {
  earthContinuityLimitOhms,
  electricalTestInputSchema,
  electricalTestOutcome,
  type ElectricalTestInput,
} from './electrical-test.ts';

// Source of every limit here: IET Code of Practice for In-service Inspection and Testing of Electrical
// Equipment (5th edition, 2020), from memory: earth continuity at most 0.1 ohm plus the cord's protective
// conductor; insulation resistance at 500 V d.c. at least 1 megohm (Class I) or 2 megohms (Class II); no
// earth continuity test on Class II; polarity checked on leads with a plug and a socket-outlet.

const classI: ElectricalTestInput = {
  equipmentClass: 'I',
  visual: 'pass',
  earthContinuityOhms: 0.08,
  insulationResistanceMohms: 200,
  polarity: 'not_applicable',
  testerUsed: 'Tester T-2',
  testerCalibratedOn: '2026-06-01',
};

describe('earth continuity limit (IET Code of Practice, from memory)', () => {
  it('is 0.1 ohm without the cord', () => {
    expect(earthContinuityLimitOhms()).toBe(0.1);
  });
  it('adds the cord: 5 m of 1.5 mm² at 13.3 milliohms per metre is 0.0665, so 0.167 ohm', () => {
    expect(earthContinuityLimitOhms(5, 1.5)).toBe(0.167);
  });
  it('adds the cord: 2 m of 1.0 mm² at 19.5 milliohms per metre is 0.039, so 0.139 ohm', () => {
    expect(earthContinuityLimitOhms(2, 1)).toBe(0.139);
  });
});

describe('electricalTestOutcome', () => {
  it('a Class I item inside every limit passes', () => {
    expect(electricalTestOutcome(classI)).toEqual({
      result: 'pass',
      earthLimitOhms: 0.1,
      insulationMinMohms: 1,
      failures: [],
    });
  });
  it('earth continuity over 0.1 ohm fails without a cord, passes with 5 m of 1.5 mm² cord', () => {
    const reading = { ...classI, earthContinuityOhms: 0.15 };
    expect(electricalTestOutcome(reading).result).toBe('fail');
    expect(electricalTestOutcome(reading).failures).toEqual(['Earth continuity 0.15 Ω is over the 0.1 Ω limit.']);
    expect(electricalTestOutcome({ ...reading, cordLengthM: 5, cordSizeMm2: 1.5 }).result).toBe('pass');
  });
  it('insulation under 1 megohm fails Class I; exactly 1 passes', () => {
    expect(electricalTestOutcome({ ...classI, insulationResistanceMohms: 0.9 }).result).toBe('fail');
    expect(electricalTestOutcome({ ...classI, insulationResistanceMohms: 1 }).result).toBe('pass');
  });
  it('Class II needs 2 megohms: 1.5 fails, 2 passes, and no earth limit applies', () => {
    const classII: ElectricalTestInput = { ...classI, equipmentClass: 'II', earthContinuityOhms: null };
    expect(electricalTestOutcome({ ...classII, insulationResistanceMohms: 1.5 })).toMatchObject({
      result: 'fail',
      earthLimitOhms: null,
      insulationMinMohms: 2,
    });
    expect(electricalTestOutcome({ ...classII, insulationResistanceMohms: 2 }).result).toBe('pass');
  });
  it('a failed visual check or wrong polarity fails the item whatever the readings', () => {
    expect(electricalTestOutcome({ ...classI, visual: 'fail' }).failures).toEqual(['Visual check failed.']);
    expect(electricalTestOutcome({ ...classI, polarity: 'fail' }).failures).toEqual(['Polarity is wrong.']);
  });
});

describe('electricalTestInputSchema', () => {
  const messages = (input: unknown) =>
    electricalTestInputSchema.safeParse(input).error?.issues.map((i) => `${i.path.join('.')}: ${i.message}`) ?? [];

  it('accepts a complete Class I test', () => {
    expect(messages(classI)).toEqual([]);
  });
  it('refuses an earth continuity reading on Class II (it has no earth)', () => {
    expect(messages({ ...classI, equipmentClass: 'II' })).toEqual([
      'earthContinuityOhms: Class II equipment has no earth: leave earth continuity empty.',
    ]);
  });
  it('asks for the readings when the visual check passed, but not when it failed', () => {
    const noReadings = { ...classI, earthContinuityOhms: null, insulationResistanceMohms: null };
    expect(messages(noReadings)).toEqual([
      'earthContinuityOhms: Enter the earth continuity reading in ohms (Class I).',
      'insulationResistanceMohms: Enter the insulation resistance in megohms.',
    ]);
    expect(messages({ ...noReadings, visual: 'fail' })).toEqual([]);
  });
  it('refuses a cord size not in the table and a length without a size', () => {
    expect(messages({ ...classI, cordLengthM: 3, cordSizeMm2: 1.1 })).toEqual([
      'cordSizeMm2: Cord conductor size must be one of 0.5, 0.75, 1, 1.25, 1.5, 2.5 mm².',
    ]);
    expect(messages({ ...classI, cordLengthM: 3 })).toEqual([
      'cordSizeMm2: Give both the cord’s length and its conductor size, or neither.',
    ]);
  });
});
