import { createContext, useContext, useEffect, useState, useSyncExternalStore, type ReactNode } from 'react';
import { AutosaveStore, type SlotOptions, type UnsavedSlot } from '@/features/jobs/api/autosave-store';
import { clearDraft, loadDraft, saveDraft } from '@/lib/offline/drafts';

const AutosaveContext = createContext<AutosaveStore | null>(null);
const SAVE_AFTER_MS = 250;

/** The phone's draft of a job sheet's fields: what was typed and not yet saved or queued (lib/offline/drafts.ts). */
export const sheetDraftKey = (jobId: number) => `job:${jobId}:sheet-fields`;

/**
 * One store per job page: its fields' drafts outlive the radiator card they were typed in, and are kept on the phone
 * from the first keystroke (a reload, a crash or a closed tab brings them back, and what is valid is sent).
 */
export function AutosaveProvider({ jobId, children }: { jobId: number; children: ReactNode }) {
  const [{ store, flush }] = useState(() => {
    let timer: ReturnType<typeof setTimeout> | null = null;
    let latest: Record<string, unknown> | null = null;
    const write = () => {
      if (timer) clearTimeout(timer);
      timer = null;
      if (!latest) return;
      const drafts = latest;
      latest = null;
      void (Object.keys(drafts).length ? saveDraft(sheetDraftKey(jobId), drafts) : clearDraft(sheetDraftKey(jobId)));
    };
    const persist = (drafts: Record<string, unknown>) => {
      latest = drafts;
      if (!timer) timer = setTimeout(write, SAVE_AFTER_MS);
    };
    return { store: new AutosaveStore(persist), flush: write };
  });
  useEffect(() => {
    let cancelled = false;
    void loadDraft<Record<string, unknown>>(sheetDraftKey(jobId)).then((draft) => {
      if (!cancelled && draft) store.seed(draft.value);
    });
    const onHide = () => {
      if (document.visibilityState === 'hidden') flush();
    };
    document.addEventListener('visibilitychange', onHide);
    window.addEventListener('pagehide', flush);
    return () => {
      cancelled = true;
      flush();
      document.removeEventListener('visibilitychange', onHide);
      window.removeEventListener('pagehide', flush);
    };
  }, [jobId, store, flush]);
  return <AutosaveContext.Provider value={store}>{children}</AutosaveContext.Provider>;
}

export function useAutosaveStore(): AutosaveStore {
  const store = useContext(AutosaveContext);
  if (!store) throw new Error('useAutosaveStore needs an AutosaveProvider above it.');
  return store;
}

/** A field (or a pair of fields) that saves itself once valid; see AutosaveStore. */
export function useAutosave<D, I>(key: string, initialDraft: () => D, options: SlotOptions<D, I>) {
  const store = useAutosaveStore();
  // Registering is idempotent: the first render creates the slot, later ones refresh how it sends.
  store.slot(key, store.view<D>(key)?.draft ?? initialDraft(), options);
  const view = useSyncExternalStore(store.subscribe, () => store.view<D>(key)!);
  return {
    ...view,
    edit: (draft: D) => store.edit(key, draft),
    settle: (draft: D) => store.settle(key, draft),
    flush: () => store.flush(key),
  };
}

/** Input on the page that is not saved yet (for the completion guard and the saved marks). */
export function useUnsavedSlots(): UnsavedSlot[] {
  const store = useAutosaveStore();
  return useSyncExternalStore(store.subscribe, store.unsaved);
}
