import { createContext, useContext, useState, useSyncExternalStore, type ReactNode } from 'react';
import { AutosaveStore, type SlotOptions, type UnsavedSlot } from '@/features/jobs/api/autosave-store';

const AutosaveContext = createContext<AutosaveStore | null>(null);

/** One store per job page: its fields' drafts outlive the radiator card they were typed in. */
export function AutosaveProvider({ children }: { children: ReactNode }) {
  const [store] = useState(() => new AutosaveStore());
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
    flush: () => store.flush(key),
  };
}

/** Input on the page that is not saved yet (for the completion guard and the saved marks). */
export function useUnsavedSlots(): UnsavedSlot[] {
  const store = useAutosaveStore();
  return useSyncExternalStore(store.subscribe, store.unsaved);
}
