import { describe, expect, it } from 'vitest';
import { surveySchema, surveyVolume } from '@heatfleet/domain';
import {
  draftToLiveSurvey,
  draftToSurveyInput,
  emptyPipeRun,
  emptyRadiator,
  initialSurveyDraft,
  panelSizePresets,
  radiatorCountLine,
  radiatorsByCount,
  surveyToDraft,
  towelRailSizePresets,
  type SurveyDraft,
} from './survey-draft';

function draft(patch: Partial<SurveyDraft>): SurveyDraft {
  return { ...initialSurveyDraft(), heatExchangerLitres: '', ...patch };
}

describe('the survey draft while typing', () => {
  it('reads a comma as the decimal point, as many phones\u2019 keypads type it', () => {
    const d = draft({ pipeRuns: [{ ...emptyPipeRun(), tube: '15', lengthM: '12,5' }] });
    expect(draftToLiveSurvey(d).pipeRuns).toEqual([{ tube: '15', lengthM: 12.5 }]);
  });

  it('leaves out half-typed or out-of-range figures instead of stalling the live volume', () => {
    const d = draft({
      radiators: [{ ...emptyRadiator(), heightMm: '6', lengthMm: '1000' }],
      pipeRuns: [
        { ...emptyPipeRun(), tube: 'plastic', boreMm: '', lengthM: '10' },
        { ...emptyPipeRun(), tube: '22', lengthM: 'abc' },
      ],
    });
    const live = draftToLiveSurvey(d);
    expect(live.radiators[0]).toMatchObject({ room: 'Radiator 1', heightMm: null, lengthMm: 1000 });
    expect(live.pipeRuns).toEqual([]);
  });

  it('a 15 mm copper run of 10 m holds about 1.45 L (EN 1057: 15 x 0.7 mm tube, 13.6 mm bore)', () => {
    // pi / 4 x 13.6^2 mm^2 x 1 m = 145.27 cm^3 per metre, so 1.4527 L for 10 m.
    const d = draft({ pipeRuns: [{ ...emptyPipeRun(), tube: '15', lengthM: '10' }] });
    expect(surveyVolume(draftToLiveSurvey(d)).pipeworkLitres).toBeCloseTo(1.4527, 3);
  });
});

describe('the survey draft on submit', () => {
  it('sends what was typed, so the shared schema refuses "abc" in words rather than the draft guessing', () => {
    const d = draft({ pipeRuns: [{ ...emptyPipeRun(), tube: '22', lengthM: 'abc' }] });
    const parsed = surveySchema.safeParse(draftToSurveyInput(d));
    expect(parsed.success).toBe(false);
    expect(parsed.error!.issues.map((i) => i.path.join('.'))).toContain('pipeRuns.0.lengthM');
  });

  it('sends a bore only for plastic pipe', () => {
    const d = draft({
      pipeRuns: [
        { ...emptyPipeRun(), tube: '15', boreMm: '11', lengthM: '3' },
        { ...emptyPipeRun(), tube: 'plastic', boreMm: '11', lengthM: '3' },
      ],
    });
    const input = draftToSurveyInput(d) as { pipeRuns: object[] };
    expect(input.pipeRuns).toEqual([
      { tube: '15', lengthM: 3 },
      { tube: 'plastic', boreMm: 11, lengthM: 3 },
    ]);
  });
});

describe('the survey by count', () => {
  const preset = (key: string, list = panelSizePresets) => list.find((p) => p.key === key)!;

  it('adds radiators of one kind and size, named after those of that kind already listed', () => {
    const doubles = radiatorsByCount([], 'double', 10, preset('600x1000'));
    const singles = radiatorsByCount(doubles, 'single', 6, preset('600x800'));
    const rails = radiatorsByCount([...doubles, ...singles], 'towel_rail', 2, preset('800x500', towelRailSizePresets));
    const all = [...doubles, ...singles, ...rails];
    expect(all).toHaveLength(18);
    expect(doubles[9]).toMatchObject({ room: 'Double panel 10', panel: 'double', heightMm: '600', lengthMm: '1000' });
    expect(radiatorsByCount(doubles, 'double', 1, preset('none'))[0]).toMatchObject({
      room: 'Double panel 11',
      heightMm: '',
      lengthMm: '',
    });
    expect(radiatorCountLine(all)).toBe('10 double panel 600 × 1000, 6 single panel 600 × 800, 2 towel rail 800 × 500');
    // 10 doubles of 600 x 1000 at 6 L/m (from memory): 60 L; the schema takes the survey as built.
    const survey = surveySchema.parse(draftToSurveyInput({ ...draft({}), radiators: doubles }));
    expect(surveyVolume({ ...survey, pipeRuns: [{ tube: '15', lengthM: 1 }] }).radiatorsLitres).toBeCloseTo(60, 6);
  });

  it('a saved survey comes back into the form as it was typed', () => {
    const survey = surveySchema.parse(
      draftToSurveyInput({
        ...draft({ heatExchangerLitres: '12.5' }),
        radiators: radiatorsByCount([], 'column', 2, preset('600x600')),
      }),
    );
    expect(surveySchema.parse(draftToSurveyInput(surveyToDraft(survey)))).toEqual(survey);
  });
});
