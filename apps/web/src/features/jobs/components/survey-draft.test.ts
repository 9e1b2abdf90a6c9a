import { describe, expect, it } from 'vitest';
import { surveySchema, surveyVolume } from '@heatfleet/domain';
import {
  draftToLiveSurvey,
  draftToSurveyInput,
  emptyPipeRun,
  emptyRadiator,
  initialSurveyDraft,
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
