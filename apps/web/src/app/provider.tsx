import { useEffect, useState, type ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { PageSpinner } from '@/components/ui/page-spinner';
import { queryClient } from '@/lib/query-client';
import { startOffline } from '@/lib/offline/start-offline';

// Once per page: the saved data of the last person and firm comes back from the phone before anything renders,
// so a page opened with no signal shows it rather than a spinner (README, Working offline).
let offlineStarted: Promise<void> | null = null;
let offlineReady = false;

export function startOfflineOnce(): Promise<void> {
  offlineStarted ??= startOffline(queryClient)
    .catch(() => undefined)
    .then(() => {
      offlineReady = true;
    });
  return offlineStarted;
}

export function AppProvider({ children }: { children: ReactNode }) {
  // Already true when main.tsx waited for it (a page whose markup came with the HTML, then hydrated).
  const [ready, setReady] = useState(offlineReady);
  useEffect(() => {
    if (ready) return;
    let live = true;
    void startOfflineOnce().then(() => {
      if (live) setReady(true);
    });
    return () => {
      live = false;
    };
  }, [ready]);
  if (!ready) return <PageSpinner />;
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
