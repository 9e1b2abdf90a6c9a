import { useEffect, useRef, useState } from 'react';
import { loadDraft, saveDraft } from '@/lib/offline/drafts';

const SAVE_AFTER_MS = 250;

/**
 * Keeps a form that holds its values in state (the booking and its survey) as a draft on the phone (IndexedDB) from
 * the first change: a reload, a crash or a closed tab brings it back. The form clears it (clearDraft) once the server
 * has it. A key of null keeps nothing.
 */
export function useValuesDraft<T>(key: string | null, values: T, restore: (value: T) => void) {
  const [restoredAt, setRestoredAt] = useState<number | null>(null);
  const loaded = useRef(false);
  const first = useRef(values);
  const restoreRef = useRef(restore);
  useEffect(() => {
    restoreRef.current = restore;
  });

  useEffect(() => {
    if (!key) return;
    let cancelled = false;
    void loadDraft<T>(key).then((draft) => {
      if (cancelled) return;
      loaded.current = true;
      if (!draft) return;
      restoreRef.current(draft.value);
      setRestoredAt(draft.savedAt);
    });
    return () => {
      cancelled = true;
    };
  }, [key]);

  useEffect(() => {
    // Nothing is saved before the stored draft is read (it would be overwritten) or while nothing has changed.
    if (!key || !loaded.current || values === first.current) return;
    const timer = setTimeout(() => void saveDraft(key, values), SAVE_AFTER_MS);
    const now = () => void saveDraft(key, values);
    window.addEventListener('pagehide', now);
    return () => {
      clearTimeout(timer);
      window.removeEventListener('pagehide', now);
    };
  }, [key, values]);

  return restoredAt;
}
