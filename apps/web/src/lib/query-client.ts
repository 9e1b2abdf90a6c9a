import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';

declare module '@tanstack/react-query' {
  interface Register {
    queryMeta: {
      /** Marks the query that says who is signed in; it is refetched when any request finds the session gone. */
      session?: boolean;
      /** false: not kept on the phone for offline use (lib/offline/query-persistence.ts). */
      persist?: boolean;
    };
  }
}

function refetchSessionOn401(error: unknown): void {
  if (isApiError(error, 401)) {
    void queryClient.invalidateQueries({ predicate: (query) => query.meta?.session === true });
  }
}

export const queryClient: QueryClient = new QueryClient({
  queryCache: new QueryCache({ onError: refetchSessionOn401 }),
  mutationCache: new MutationCache({ onError: refetchSessionOn401 }),
  defaultOptions: {
    queries: {
      // Others change the same records (a colleague joins, stock moves): show the cache at once, then refetch on every visit.
      staleTime: 0,
      // Tried once even with no signal: the service worker may answer from its copy (lib/offline). Retries wait for the signal.
      networkMode: 'offlineFirst',
      // A 4xx will not change on retry; network blips and 5xx might. With no signal the retry waits for it, and a
      // page keeps showing the copy it has (lib/offline) meanwhile.
      retry: (failureCount, error) => {
        if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
        return failureCount < 2;
      },
    },
    // A write not yet through the queue (lib/offline) fails at once with no signal instead of waiting unseen.
    mutations: { retry: false, networkMode: 'always' },
  },
});
