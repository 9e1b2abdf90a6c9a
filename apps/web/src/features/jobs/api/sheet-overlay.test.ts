import { describe, expect, it } from 'vitest';
import type { JobDetail } from '@heatfleet/domain';
import type { QueuedWrite } from '@/lib/offline/outbox';
import { overlayQueued } from './sheet-overlay';

// The sheet as the phone shows it with writes still waiting in its queue (DEVELOPERS.md, Working offline).

const sheet = {
  editable: true,
  coldBottomThresholdK: 10,
  radiators: [
    {
      index: 0,
      room: 'Lounge',
      panel: 'double',
      ratedWatts: null,
      before: null,
      after: null,
      flushedAt: null,
      agitation: null,
    },
  ],
  steps: [{ step: 'flush', label: 'Flush', cautions: [], doneAt: null, doneByName: null }],
  water: {
    mainsTdsPpm: null,
    systemTdsPpm: null,
    waterClear: null,
    inhibitorReading: null,
    inhibitorProductId: null,
    ph: null,
    figures: { flush: null, inhibitor: null },
  },
  kitOnVan: [{ id: 7, assetTag: 'AGI-1', kindName: 'Agitator head', kitName: 'Rig 1', vibrationMs2: 10 }],
  kitUsed: [],
  photos: [],
  signatures: [],
  notes: 'Theirs',
  notesVersion: 3,
};
const detail = { job: { id: 5, status: 'planned' }, sheet } as unknown as JobDetail;

let seq = 0;
function write(path: string, body: unknown, extra: Partial<QueuedWrite> = {}): QueuedWrite {
  seq += 1;
  return {
    id: `w${seq}`,
    seq: `00000000000000${seq}-001`,
    userId: 1,
    firmId: 1,
    firmName: 'F',
    method: 'PUT',
    path,
    body,
    idempotencyKey: `k${seq}`,
    tappedAt: '2026-12-03T10:42:00.000Z',
    label: path,
    state: 'waiting',
    attempts: 0,
    ...extra,
  };
}

describe('overlayQueued', () => {
  it('shows a waiting reading with the domain figures, the agitation with its tool, the flush at its tap time', () => {
    const shown = overlayQueued(detail, [
      write('/api/jobs/5/radiators/0/readings/before', { topC: 68, bottomC: 48 }),
      write('/api/jobs/5/radiators/0/agitation', { minutes: 3, kitItemId: 7 }),
      write('/api/jobs/5/radiators/0/flushed', { done: true }),
    ]).sheet.radiators[0]!;
    // Top to bottom 20 K is over the 10 K threshold: a cold bottom (common practice (no source)).
    expect(shown.before).toMatchObject({ topC: 68, bottomC: 48, differenceK: 20, coldBottom: true });
    expect(shown.agitation).toMatchObject({ minutes: 3, kitItemTag: 'AGI-1', magnitudeMs2: 10 });
    expect(shown.flushedAt).toBe('2026-12-03T10:42:00.000Z');
  });

  it('raises the notes version for each waiting save, so the next is written from it; ignores other jobs and refused writes', () => {
    const shown = overlayQueued(detail, [
      write('/api/jobs/5/notes', { notes: 'Mine', notesVersion: 3 }),
      write('/api/jobs/6/notes', { notes: 'Another job' }),
      write('/api/jobs/5/radiators/0/flushed', { done: true }, { state: 'attention' }),
    ]).sheet;
    expect(shown).toMatchObject({ notes: 'Mine', notesVersion: 4 });
    expect(shown.radiators[0]!.flushedAt).toBeNull();
  });

  it('lists a waiting photo without an address, and leaves a completed job as the server has it', () => {
    const photo = write('/api/jobs/5/photos', null, {
      method: 'POST',
      form: { field: 'photo', fileName: 'a.jpg', file: new Blob(), fields: { tag: 'magnet_before' } },
    });
    expect(overlayQueued(detail, [photo]).sheet.photos).toEqual([
      expect.objectContaining({ url: '', tag: 'magnet_before', createdAt: '2026-12-03T10:42:00.000Z' }),
    ]);
    const done = { ...detail, job: { ...detail.job, status: 'completed' } } as JobDetail;
    expect(overlayQueued(done, [photo])).toBe(done);
  });
});
