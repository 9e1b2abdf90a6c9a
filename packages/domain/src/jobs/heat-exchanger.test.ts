import { describe, expect, it } from 'vitest';
import {
  builtInHeatExchangerLitres,
  heatExchangerDefaultLitres,
  heatExchangerDefaultsSchema,
} from './heat-exchanger.ts';
import { surveyVolume, type Survey } from './job-schemas.ts';
import { dosePlan } from './dose-plan.ts';

const survey = (over: Partial<Survey>): Survey => ({
  systemType: 'open_vented',
  boilerKind: 'regular',
  fuel: 'oil',
  radiators: [{ room: 'Lounge', panel: 'single' }],
  pipeRuns: [],
  ...over,
});

describe('heat exchanger defaults by boiler kind and fuel', () => {
  it('a gas combi holds about 1 L, a floor-standing oil boiler 10 to 25 L (from memory)', () => {
    expect(heatExchangerDefaultLitres('combi', 'gas')).toBe(1);
    const oilRegular = heatExchangerDefaultLitres('regular', 'oil');
    expect(oilRegular).toBeGreaterThanOrEqual(10);
    expect(oilRegular).toBeLessThanOrEqual(25);
    expect(heatExchangerDefaultsSchema.parse(builtInHeatExchangerLitres)).toEqual(builtInHeatExchangerLitres);
  });

  it('the firm\u2019s own defaults win over the built-in ones; the survey\u2019s figure wins over both', () => {
    const own = { ...builtInHeatExchangerLitres, oil: { combi: 8, system: 9, regular: 20 } };
    expect(surveyVolume(survey({}), own)).toMatchObject({ heatExchangerLitres: 20, heatExchangerFrom: 'default' });
    expect(surveyVolume(survey({ heatExchangerLitres: 18 }), own)).toMatchObject({
      heatExchangerLitres: 18,
      heatExchangerFrom: 'survey',
    });
  });

  it('the volume is "calculated from the survey" or "estimated", never "measured"', () => {
    const estimated = surveyVolume(survey({}));
    expect(estimated.label).toBe('Estimated');
    expect(estimated.howReached).toMatch(/^Estimated/);
    const calculated = surveyVolume(
      survey({
        radiators: [{ room: 'Lounge', panel: 'single', heightMm: 600, lengthMm: 1000 }],
        pipeRuns: [{ tube: '15', lengthM: 10 }],
      }),
    );
    expect(calculated.label).toBe('Calculated from the survey');
    for (const v of [estimated, calculated]) expect(`${v.label} ${v.howReached}`).not.toMatch(/measured/i);
  });

  it('dose litres carry two decimals; packs are counted from the unrounded litres', () => {
    // 123.456 L at 1 L per 100 L = 1.23456 L -> 1.23 L shown; 2 packs of 1 L.
    expect(dosePlan(123.456, 0, { packSizeMl: 1000, doseLitresPer100L: 1, radiatorsPerPack: null })).toMatchObject({
      litres: 1.23,
      packs: 2,
    });
  });
});
