import { describe, expect, it } from 'vitest';
import type { SheetRadiator } from '@heatfleet/domain';
import { defaultToolId, inFlushOrder, nextRadiator, radiatorAfter, radiatorStage } from './radiator-progress';

const reading = { topC: 60, bottomC: 40 } as unknown as SheetRadiator['before'];
function radiator(index: number, patch: Partial<SheetRadiator> = {}): SheetRadiator {
  return {
    index,
    room: `Room ${index + 1}`,
    panel: 'single',
    ratedWatts: null,
    before: null,
    after: null,
    flushedAt: null,
    agitation: null,
    ...patch,
  };
}
const agitated = (kitItemId: number | null = null) => ({
  minutes: 5,
  kitItemId,
  kitItemTag: null,
  magnitudeMs2: null,
  points: 0,
});

describe('where each radiator stands, and which comes next (common practice (no source))', () => {
  it('a radiator is read before, agitated and flushed, then read after; a flushed one has passed agitation', () => {
    expect(radiatorStage(radiator(0))).toBe('before');
    expect(radiatorStage(radiator(0, { before: reading }))).toBe('agitate');
    expect(radiatorStage(radiator(0, { before: reading, agitation: agitated() }))).toBe('flush');
    expect(radiatorStage(radiator(0, { before: reading, flushedAt: '2026-12-03T10:00:00Z' }))).toBe('after');
    expect(radiatorStage(radiator(0, { before: reading, flushedAt: 'x', after: reading }))).toBe('done');
  });

  it('follows the flush order, with any radiator it leaves out after in survey order', () => {
    const list = [radiator(0), radiator(1), radiator(2), radiator(3)];
    expect(inFlushOrder(list, [2, 0]).map((r) => r.index)).toEqual([2, 0, 1, 3]);
  });

  it('the next radiator is the earliest stage of the work first, then the flush order', () => {
    const list = inFlushOrder([radiator(0, { before: reading }), radiator(1), radiator(2)], [2, 1, 0]);
    expect(nextRadiator(list)?.index).toBe(2);
  });

  it('"Next radiator" sweeps one stage through the flush order, then moves on to the next sweep', () => {
    const list = [radiator(0, { before: reading }), radiator(1), radiator(2, { before: reading })];
    // Taking before readings on radiator 1: radiator 2 still needs one, radiator 3 does not.
    expect(radiatorAfter(list, 0, 'before')?.index).toBe(1);
    const allRead = list.map((r) => ({ ...r, before: reading }));
    // The last before reading taken: round to the first radiator for agitation and flushing.
    expect(radiatorAfter(allRead, 2, 'before')?.index).toBe(0);
    const flushing = [
      radiator(0, { before: reading, flushedAt: 'x' }),
      radiator(1, { before: reading, agitation: agitated() }),
      radiator(2, { before: reading }),
    ];
    // Agitating and flushing are one sweep: a radiator agitated but not flushed is still in it.
    expect(radiatorAfter(flushing, 0, 'agitate')?.index).toBe(1);
    const done = flushing.map((r) => ({ ...r, flushedAt: 'x', after: reading }));
    expect(radiatorAfter(done, 2, 'after')).toBeNull();
  });

  it("the vibrating tool starts as the previous radiator's, else the last used, else the van's only vibrating tool", () => {
    const tools = [
      { id: 7, vibrationMs2: 10 },
      { id: 8, vibrationMs2: null },
    ];
    const list = [radiator(0, { agitation: agitated(9) }), radiator(1), radiator(2, { agitation: agitated(11) })];
    expect(defaultToolId(list, 1, tools)).toBe(9);
    expect(defaultToolId(list, 0, tools)).toBe(11);
    expect(defaultToolId([radiator(0), radiator(1)], 1, tools)).toBe(7);
    expect(defaultToolId([radiator(0)], 0, [...tools, { id: 12, vibrationMs2: 4 }])).toBeNull();
  });
});
