import { useCallback, useRef } from 'react';

export function randomUuid(): string {
  // randomUUID exists only in secure contexts; a phone on the office network over plain http has none.
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6]! & 0x0f) | 0x40;
  bytes[8] = (bytes[8]! & 0x3f) | 0x80;
  const hex = Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

/**
 * One key per form submission. Sending the same body again (a retry after a dropped signal) reuses
 * the key, so the server replays its first answer instead of acting twice; a changed body (say, an
 * overdue reason added after the server asked for one) is a new submission and gets a new key.
 * Call `done()` after success so the next submission starts fresh.
 */
export function useIdempotencyKey() {
  const last = useRef<{ body: string; key: string } | null>(null);
  const keyFor = useCallback((body: unknown): string => {
    const serialized = JSON.stringify(body);
    if (last.current?.body === serialized) return last.current.key;
    const key = randomUuid();
    last.current = { body: serialized, key };
    return key;
  }, []);
  const done = useCallback(() => {
    last.current = null;
  }, []);
  return { keyFor, done };
}
