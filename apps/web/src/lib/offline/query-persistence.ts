import type { QueryClient } from '@tanstack/react-query';
import {
  persistQueryClientRestore,
  persistQueryClientSave,
  persistQueryClientSubscribe,
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

/**
 * TanStack Query's persister over IndexedDB (idb-keyval), under the active person and firm. Saves are throttled:
 * the cache changes on every fetch, and the last change within a second is the one that counts.
 */
function createIdbPersister(): Persister & { flush(): Promise<void> } {
  let pending: { scope: OfflineScope; client: PersistedClient } | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  const flush = async () => {
    if (timer) clearTimeout(timer);
    timer = null;
    const next = pending;
    pending = null;
    if (next) await set(cacheKey(next.scope), next.client, queryCacheStore()).catch(() => undefined);
  };
  return {
    persistClient: (client) => {
      const scope = activeScope();
      if (!scope) return;
      if (pending && (pending.scope.userId !== scope.userId || pending.scope.firmId !== scope.firmId)) void flush();
      pending = { scope, client };
      timer ??= setTimeout(() => void flush(), SAVE_EVERY_MS);
    },
    restoreClient: async () => {
      const scope = activeScope();
      return scope ? get<PersistedClient>(cacheKey(scope), queryCacheStore()) : undefined;
    },
    removeClient: async () => {
      const scope = activeScope();
      if (scope) await del(cacheKey(scope), queryCacheStore());
    },
    flush,
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

/** Keeps saving the cache as it changes; also saved at once when the page is hidden (a closed tab, a locked phone). */
export function persistQueryCache(queryClient: QueryClient): () => void {
  const unsubscribe = persistQueryClientSubscribe({ queryClient, ...options });
  const onHide = () => {
    if (document.visibilityState === 'hidden')
      void persistQueryClientSave({ queryClient, ...options }).then(persister.flush);
  };
  document.addEventListener('visibilitychange', onHide);
  return () => {
    unsubscribe();
    document.removeEventListener('visibilitychange', onHide);
  };
}
