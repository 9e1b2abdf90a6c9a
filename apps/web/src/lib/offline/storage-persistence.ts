import { useSyncExternalStore } from 'react';

export type StorageAnswer = 'kept' | 'refused' | 'unknown';
let answer: StorageAnswer = 'unknown';
const listeners = new Set<() => void>();

/**
 * Asks the browser to keep Heatfleet's storage (drafts, the write queue, the saved data) even when the phone runs
 * short of space (the Storage API's persist()). Some browsers decide by how the site is used and refuse; the app
 * then tells the engineer, who can install it to the home screen and send waiting changes promptly.
 */
export async function askPersistentStorage(): Promise<void> {
  const storage = typeof navigator === 'undefined' ? undefined : navigator.storage;
  if (!storage?.persist || !storage.persisted) return;
  try {
    const kept = (await storage.persisted()) || (await storage.persist());
    answer = kept ? 'kept' : 'refused';
  } catch {
    answer = 'refused';
  }
  for (const listener of listeners) listener();
}

export function useStorageAnswer(): StorageAnswer {
  return useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => answer,
  );
}
