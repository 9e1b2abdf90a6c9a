import { peekEarlyGet, startEarlyGet } from '@/lib/api-client';
import { queryClient } from '@/lib/query-client';

// A cold start used to be a chain: the entry script, then the page's chunk, then /api/me, then the page's data.
// Here /api/me leaves as soon as the entry runs, and a page's first read as soon as its route is matched (its
// lazy() below, beside the chunk's download), so all of them travel together. Only at boot: once the cache holds
// the person (after a sign-in or a restore), pages ask for their data as they render, and the cache answers first.

const SESSION_KEY = ['session', 'me'];

function booting(): boolean {
  return queryClient.getQueryData(SESSION_KEY) === undefined;
}

/** At module load: who is signed in, asked for at once. */
export function startBootReads(): void {
  startEarlyGet('/api/me');
}

type Role = 'owner' | 'admin' | 'stores' | 'engineer';

/** The home page's reads depend on the role (the owner's overview, or an engineer's van), so they follow /api/me. */
export function startHomeReads(): void {
  if (!booting()) return;
  void peekEarlyGet('/api/me').then((body) => {
    const role = (body as { me?: { role?: Role } | null } | null)?.me?.role;
    if (role === 'owner' || role === 'admin') startEarlyGet('/api/overview');
    else if (role === 'engineer') startEarlyGet('/api/me/van');
  });
}

/** A page whose first read has a fixed path: it starts with the page's chunk. */
export function startPageRead(path: string): void {
  if (booting()) startEarlyGet(path);
}
