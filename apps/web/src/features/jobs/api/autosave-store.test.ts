import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { AutosaveStore, type Parsed } from './autosave-store';

interface Pair {
  top: string;
  bottom: string;
}
function parse(d: Pair): Parsed<{ top: number; bottom: number }> {
  const top = d.top === '' ? null : Number(d.top);
  const bottom = d.bottom === '' ? null : Number(d.bottom);
  if (top === null && bottom === null) return { ok: false, empty: true, errors: {} };
  if (top !== null && Number.isNaN(top)) return { ok: false, empty: false, errors: { top: 'Not a number.' } };
  if (top === null || bottom === null) return { ok: false, empty: false, errors: {} };
  return { ok: true, input: { top, bottom } };
}

describe('fields that save themselves', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  function setup(send = vi.fn(() => Promise.resolve())) {
    const store = new AutosaveStore();
    store.slot<Pair, { top: number; bottom: number }>(
      'r',
      { top: '', bottom: '' },
      {
        label: 'Radiator 1: before reading',
        parse,
        send,
        savedInput: null,
      },
    );
    return { store, send };
  }

  it('a reading with one number is incomplete, counts as unsaved, and is never sent', async () => {
    const { store, send } = setup();
    store.edit('r', { top: '62', bottom: '' });
    expect(store.view('r')?.status).toBe('incomplete');
    expect(store.unsaved().map((u) => u.label)).toEqual(['Radiator 1: before reading']);
    await vi.advanceTimersByTimeAsync(5000);
    await store.flush('r');
    expect(send).not.toHaveBeenCalled();
  });

  it('once both are valid it is sent after the pause, once, and marked saved', async () => {
    const { store, send } = setup();
    store.edit('r', { top: '62', bottom: '3' });
    store.edit('r', { top: '62', bottom: '38' });
    expect(store.view('r')?.status).toBe('pending');
    await vi.advanceTimersByTimeAsync(800);
    expect(send).toHaveBeenCalledTimes(1);
    expect(send).toHaveBeenCalledWith({ top: 62, bottom: 38 });
    expect(store.view('r')).toMatchObject({ status: 'saved', stored: true });
    expect(store.unsaved()).toEqual([]);
    await store.flush('r');
    expect(send).toHaveBeenCalledTimes(1);
  });

  it('an edit while a save is in flight is sent after it, so the last figure wins', async () => {
    let release: () => void = () => {};
    const send = vi.fn(
      () =>
        new Promise<void>((resolve) => {
          release = resolve;
        }),
    );
    const { store } = setup(send);
    store.edit('r', { top: '62', bottom: '38' });
    void store.flush('r');
    store.edit('r', { top: '64', bottom: '38' });
    void store.flush('r');
    expect(send).toHaveBeenCalledTimes(1);
    release();
    await vi.advanceTimersByTimeAsync(0);
    expect(send).toHaveBeenCalledTimes(2);
    expect(send).toHaveBeenLastCalledWith({ top: 64, bottom: 38 });
    release();
    await store.flushAll();
    expect(store.view('r')?.status).toBe('saved');
  });

  it('a failed save keeps the figures, says why, and is sent again on retry', async () => {
    const send = vi.fn().mockRejectedValueOnce(new Error('No signal.')).mockResolvedValue(undefined);
    const { store } = setup(send);
    store.edit('r', { top: '62', bottom: '38' });
    await store.flush('r');
    expect(store.view('r')).toMatchObject({
      status: 'failed',
      failure: 'No signal.',
      draft: { top: '62', bottom: '38' },
    });
    expect(store.unsaved()).toHaveLength(1);
    await store.flush('r');
    expect(store.view('r')?.status).toBe('saved');
  });
});

describe('drafts of the fields on the phone', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const options = (send: () => Promise<void | 'kept'>) => ({
    label: 'Radiator 1: before reading',
    parse,
    send,
    savedInput: null,
  });

  it('hands what is typed and unsaved to persist, and nothing once it is saved (or kept in the queue)', async () => {
    const persist = vi.fn();
    const store = new AutosaveStore(persist);
    store.slot<Pair, { top: number; bottom: number }>(
      'r',
      { top: '', bottom: '' },
      options(() => Promise.resolve('kept')),
    );
    store.edit('r', { top: '62', bottom: '' });
    expect(persist).toHaveBeenLastCalledWith({ r: { top: '62', bottom: '' } });
    store.edit('r', { top: '62', bottom: '40' });
    await vi.advanceTimersByTimeAsync(800);
    expect(persist).toHaveBeenLastCalledWith({});
    expect(store.view('r')).toMatchObject({ status: 'saved', kept: true });
  });

  it('a draft seeded from an earlier page comes back into its field and, being valid, is sent', async () => {
    const send = vi.fn(() => Promise.resolve());
    const store = new AutosaveStore();
    store.seed({ r: { top: '70', bottom: '51' } });
    store.slot<Pair, { top: number; bottom: number }>('r', { top: '', bottom: '' }, options(send));
    expect(store.view<Pair>('r')?.draft).toEqual({ top: '70', bottom: '51' });
    await vi.advanceTimersByTimeAsync(800);
    expect(send).toHaveBeenCalledWith({ top: 70, bottom: 51 });
  });
});
