import { useEffect, useState, type ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';
import { PageSpinner } from '@/components/ui/page-spinner';
import { queryClient } from '@/lib/query-client';
import { startOffline } from '@/lib/offline/start-offline';

// Once per page: the saved data of the last person and firm comes back from the phone before anything renders,
// so a page opened with no signal shows it rather than a spinner (README, Working offline).
let offlineStarted: Promise<void> | null = null;

export function AppProvider({ children }: { children: ReactNode }) {
  const [ready, setReady] = useState(false);
  useEffect(() => {
    let live = true;
    offlineStarted ??= startOffline(queryClient).catch(() => undefined);
    void offlineStarted.then(() => {
      if (live) setReady(true);
    });
    return () => {
      live = false;
    };
  }, []);
  if (!ready) return <PageSpinner />;
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
