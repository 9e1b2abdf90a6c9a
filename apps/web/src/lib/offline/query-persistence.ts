import type { QueryClient } from '@tanstack/react-query';
import {
  persistQueryClientRestore,
  persistQueryClientSave,
  type PersistedClient,
  type Persister,
} from '@tanstack/query-persist-client-core';
import { del, get, set } from 'idb-keyval';
import { activeScope, queryCacheStore, scopePrefix, type OfflineScope } from '@/lib/offline/scope';

// Raise when a cached answer's shape changes so that an older copy would break a screen; a build number would
// throw the engineer's offline data away at every update.
const CACHE_VERSION = '1';
// As long as the server accepts a queued write's tap time (apps/api/src/middleware/tapped-at.ts).
const MAX_AGE_MS = 7 * 86_400_000;
const SAVE_EVERY_MS = 1_000;

const cacheKey = (scope: OfflineScope) => `${scopePrefix(scope)}query-cache`;

/** TanStack Query's persister over IndexedDB (idb-keyval), under the person and firm active when it saves. */
function createIdbPersister(): Persister {
  return {
    persistClient: async (client: PersistedClient) => {
      const scope = activeScope();
      if (!scope) return;
      await set(cacheKey(scope), client, queryCacheStore()).catch(() => undefined);
      // Signed out while it was being written: it must not outlive the sign-out's wipe.
      if (!activeScope()) await del(cacheKey(scope), queryCacheStore()).catch(() => undefined);
    },
    restoreClient: async () => {
      const scope = activeScope();
      return scope ? get<PersistedClient>(cacheKey(scope), queryCacheStore()) : undefined;
    },
    removeClient: async () => {
      const scope = activeScope();
      if (scope) await del(cacheKey(scope), queryCacheStore());
    },
  };
}

const persister = createIdbPersister();
const options = {
  persister,
  buster: CACHE_VERSION,
  // Queries only: writes are kept by the write queue (lib/offline/outbox.ts), not as paused mutations.
  dehydrateOptions: {
    shouldDehydrateMutation: () => false,
    shouldDehydrateQuery: (query: { state: { status: string }; meta?: { persist?: boolean } | undefined }) =>
      query.state.status === 'success' && query.meta?.persist !== false,
  },
};

/** Puts back what this person and firm last saw, so the app shows it with no signal. Never throws. */
export async function restoreQueryCache(queryClient: QueryClient): Promise<void> {
  if (!activeScope()) return;
  await persistQueryClientRestore({ queryClient, ...options, maxAge: MAX_AGE_MS }).catch(() => undefined);
}

/**
 * Keeps saving the cache as it changes, at most once a second (the cache changes on every fetch, and writing the
 * whole of it each time would cost the phone's time for nothing); at once when the page is hidden (a closed tab, a
 * locked phone).
 */
export function persistQueryCache(queryClient: QueryClient): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  const save = () => {
    if (timer) clearTimeout(timer);
    timer = null;
    void persistQueryClientSave({ queryClient, ...options });
  };
  const unsubscribe = queryClient.getQueryCache().subscribe((event) => {
    if (event.type === 'added' || event.type === 'removed' || event.type === 'updated')
      timer ??= setTimeout(save, SAVE_EVERY_MS);
  });
  const onHide = () => {
    if (document.visibilityState === 'hidden' && timer) save();
  };
  document.addEventListener('visibilitychange', onHide);
  return () => {
    unsubscribe();
    if (timer) clearTimeout(timer);
    document.removeEventListener('visibilitychange', onHide);
  };
}
