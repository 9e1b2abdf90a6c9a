import { describe, expect, it, vi } from 'vitest';
import { forgetCachedAnswers, noteAnswer, oldestCachedAnswer, onCopyAfterReconnect } from './data-age';

// The "as of" note (README "Working offline"): a page shows it while what it shows came from the phone's copy.
describe('how old the data on screen may be', () => {
  it('an older request answered from the copy after a newer fresh answer does not bring the note back', () => {
    forgetCachedAnswers();
    noteAnswer('/api/jobs/1', { fromCache: false, madeAt: 2_000, startedAt: 200 });
    noteAnswer('/api/jobs/1', { fromCache: true, madeAt: 1_000, startedAt: 100 });
    expect(oldestCachedAnswer()).toBeNull();
  });

  it('a copy answered to a request made before the signal came back asks for fresh reads, and their answer clears the note', () => {
    const refresh = vi.fn();
    const stop = onCopyAfterReconnect(refresh);
    const offlineStart = Date.now() - 1_000;
    vi.stubGlobal('navigator', { onLine: false });
    noteAnswer('/api/vans/mine', { fromCache: true, madeAt: 500, startedAt: offlineStart - 500 });
    expect(oldestCachedAnswer()).toBe(500);
    expect(refresh).not.toHaveBeenCalled();
    vi.stubGlobal('navigator', { onLine: true });
    forgetCachedAnswers(); // the 'online' event
    expect(oldestCachedAnswer()).toBeNull();
    // The read that was still on its way when the signal came back.
    noteAnswer('/api/vans/mine', { fromCache: true, madeAt: 500, startedAt: offlineStart });
    expect(refresh).toHaveBeenCalledTimes(1);
    expect(oldestCachedAnswer()).toBe(500);
    noteAnswer('/api/vans/mine', { fromCache: false, madeAt: Date.now(), startedAt: Date.now() });
    expect(oldestCachedAnswer()).toBeNull();
    stop();
    vi.unstubAllGlobals();
  });

  it('a copy answered to a request made after the reconnect (the server is down) keeps its note and asks nothing', () => {
    const refresh = vi.fn();
    const stop = onCopyAfterReconnect(refresh);
    forgetCachedAnswers();
    const later = Date.now() + 1;
    noteAnswer('/api/stock', { fromCache: true, madeAt: 700, startedAt: later });
    expect(refresh).not.toHaveBeenCalled();
    expect(oldestCachedAnswer()).toBe(700);
    stop();
  });
});
