import { useSyncExternalStore } from 'react';

/**
 * How old the data on screen may be: API reads answered from the service worker's cache (with no signal) carry the
 * time the server first made them, so the app can say "as of 10:42". A fresh answer for the same path clears it.
 * Fresh answers also tell how far the phone's clock is from the server's, so a tap time can be sent in the
 * server's terms (a phone a few minutes fast would otherwise have its queued writes refused as "in the future").
 */
const cachedSince = new Map<string, number>();
// When each path's latest noted request started: an older request's answer arriving after a newer one's is stale news.
const latestStart = new Map<string, number>();
// When the signal last came back; a copy answered to a request made before then was made without signal.
let reconnectedAt = 0;
const reconnectListeners = new Set<() => void>();
let serverOffsetMs: number | null = null;
let version = 0;
const listeners = new Set<() => void>();

export function noteAnswer(
  path: string,
  answer: { fromCache: boolean; madeAt: number | null; startedAt: number },
): void {
  if (answer.startedAt < (latestStart.get(path) ?? -Infinity)) return;
  latestStart.set(path, answer.startedAt);
  const before = cachedSince.size;
  if (answer.fromCache) {
    cachedSince.set(path, answer.madeAt ?? Date.now());
  } else {
    cachedSince.delete(path);
    // The Date header has whole seconds, so the offset is known to about a second: ample against a minute's allowance.
    if (answer.madeAt !== null) serverOffsetMs = answer.madeAt - Date.now();
  }
  if (answer.fromCache || before !== cachedSince.size) {
    version += 1;
    for (const listener of listeners) listener();
  }
  // A read still on its way when the signal came back is answered from the copy after the reconnect's refetches were
  // decided (TanStack Query joins a fetch in flight rather than starting another), so the page would keep its old data
  // and its "as of" note: ask for fresh reads.
  const online = typeof navigator === 'undefined' || navigator.onLine !== false;
  if (answer.fromCache && answer.startedAt < reconnectedAt && online) {
    for (const listener of reconnectListeners) listener();
  }
}

/** Calls `listener` when a copy made without signal answers after the signal came back (see noteAnswer). */
export function onCopyAfterReconnect(listener: () => void): () => void {
  reconnectListeners.add(listener);
  return () => reconnectListeners.delete(listener);
}

/** The phone's time in the server's clock (ms), as well as the last fresh answer tells. */
export function serverNow(): number {
  return Date.now() + (serverOffsetMs !== null && Math.abs(serverOffsetMs) > 2_000 ? serverOffsetMs : 0);
}

/** The oldest answer now shown from the service worker's cache, or null when everything came fresh. */
export function oldestCachedAnswer(): number | null {
  let oldest: number | null = null;
  for (const at of cachedSince.values()) oldest = oldest === null ? at : Math.min(oldest, at);
  return oldest;
}

export function useOldestCachedAnswer(): number | null {
  useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => version,
  );
  return oldestCachedAnswer();
}

/** When the network comes back every read is fresh again; the next answers say so path by path. */
export function forgetCachedAnswers(): void {
  reconnectedAt = Date.now();
  if (cachedSince.size === 0) return;
  cachedSince.clear();
  version += 1;
  for (const listener of listeners) listener();
}
