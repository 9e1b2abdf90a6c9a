import { describe, expect, it } from 'vitest';
import { completionChecks, type CompletionFacts } from './completion-checks.ts';

const done: CompletionFacts = {
  visitKind: 'full_clean',
  circulation: { minimumMinutes: 60, startedAt: '2026-12-03T09:00:00.000Z', elapsedMinutes: 65, met: true },
  radiators: [
    { room: 'Lounge', after: {}, flushedAt: '2026-12-03T11:00:00.000Z' },
    { room: 'Hall', after: {}, flushedAt: '2026-12-03T11:10:00.000Z' },
  ],
  water: { mainsTdsPpm: 180, systemTdsPpm: 190, inhibitorReading: 120 },
};

describe('completionChecks: what completing asks a reason for (DEVELOPERS.md, Product rules)', () => {
  it('asks for nothing when the visit is whole', () => {
    expect(completionChecks(done)).toEqual([]);
  });

  it('names each thing not done, with what was found', () => {
    const issues = completionChecks({
      ...done,
      circulation: { ...done.circulation, elapsedMinutes: 40, met: false },
      radiators: [
        { room: 'Lounge', after: null, flushedAt: null },
        { room: 'Hall', after: {}, flushedAt: '2026-12-03T11:10:00.000Z' },
      ],
      water: { mainsTdsPpm: null, systemTdsPpm: null, inhibitorReading: null },
      unsavedInput: true,
    });
    expect(issues.map((i) => i.code)).toEqual([
      'circulation_short',
      'no_water_test',
      'after_readings_missing',
      'flush_ticks_missing',
      'unsaved_input',
    ]);
    expect(issues[0]!.found).toBe('Hot circulation ran 40 of the cleaner\u2019s minimum 60 minutes.');
    expect(issues[2]!.found).toBe('1 of 2 radiators have no after reading: Lounge.');
  });

  it('a cleaner with no minimum never asks about circulation', () => {
    expect(
      completionChecks({
        ...done,
        circulation: { minimumMinutes: null, startedAt: null, elapsedMinutes: null, met: null },
      }),
    ).toEqual([]);
  });

  it('an inhibitor-only visit asks only for the inhibitor reading', () => {
    const facts: CompletionFacts = {
      visitKind: 'inhibitor_only',
      circulation: { minimumMinutes: 60, startedAt: null, elapsedMinutes: null, met: false },
      radiators: [{ room: 'Lounge', after: null, flushedAt: null }],
      water: { mainsTdsPpm: null, systemTdsPpm: null, inhibitorReading: null },
    };
    expect(completionChecks(facts).map((i) => i.code)).toEqual(['no_water_test']);
    expect(completionChecks({ ...facts, water: { ...facts.water, inhibitorReading: 110 } })).toEqual([]);
  });
});
