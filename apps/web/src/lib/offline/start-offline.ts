import type { QueryClient } from '@tanstack/react-query';
import type { Me } from '@heatfleet/domain';
import { API_CACHE } from '@/lib/offline/api-cache-rules';
import { startServiceWorker } from '@/lib/offline/app-update';
import { forgetCachedAnswers, onCopyAfterReconnect } from '@/lib/offline/data-age';
import { outboxWrites, reloadOutbox } from '@/lib/offline/outbox';
import { sendOutbox, setOutboxQueryClient } from '@/lib/offline/outbox-sender';
import { persistQueryCache, restoreQueryCache } from '@/lib/offline/query-persistence';
import { activeScope, sameScope, setActiveScope, wipePerson, type OfflineScope } from '@/lib/offline/scope';
import { askPersistentStorage } from '@/lib/offline/storage-persistence';

export function scopeOf(me: Me): OfflineScope {
  return { userId: me.user.id, firmId: me.activeFirm.id };
}

const notSession = (query: { meta?: { session?: boolean } | undefined }) => query.meta?.session !== true;

/**
 * The session as the server tells it (a sign-in, a firm switch, /api/me after a reload). When it belongs to
 * another person than the data kept on the phone, that data leaves the screen; another firm is fetched afresh.
 */
function adoptSession(client: QueryClient, me: Me): void {
  const next = scopeOf(me);
  const previous = activeScope();
  if (!sameScope(previous, next)) {
    if (previous && previous.userId !== next.userId) client.removeQueries({ predicate: notSession });
    else if (previous) void client.resetQueries({ predicate: notSession });
    setActiveScope(next);
    void askPersistentStorage();
    void reloadOutbox(next.userId).then(() => sendOutbox());
    return;
  }
  // The same person again (signed in after the session ran out): what waited for them goes now.
  if (outboxWrites().some((write) => write.state === 'waiting')) void sendOutbox();
}

/** A firm switch made here: the scope moves first, so nothing is saved under the wrong firm meanwhile. */
export function moveToFirm(me: Me): void {
  setActiveScope(scopeOf(me));
}

/**
 * Sign-out: everything of this person on the phone goes (the saved data, drafts, the queue, the service worker's
 * copies of API answers). The sign-out button has already sent what was waiting, or the engineer chose to drop it.
 */
export async function forgetPerson(): Promise<void> {
  const scope = activeScope();
  setActiveScope(null);
  await reloadOutbox(null);
  if (scope) await wipePerson(scope.userId).catch(() => undefined);
  if (typeof caches !== 'undefined') await caches.delete(API_CACHE).catch(() => false);
}

/**
 * Starts everything offline once, before the app renders: the saved query cache of the last person and firm is
 * put back, then kept up to date; the queue is loaded and sent (the app opening is one of its moments, the signal
 * returning another); the service worker is registered.
 */
export async function startOffline(client: QueryClient): Promise<void> {
  setOutboxQueryClient(client);
  const scope = activeScope();
  // With no IndexedDB answer within 3 s the app starts anyway, without the saved copy.
  await Promise.race([restoreQueryCache(client), new Promise((resolve) => setTimeout(resolve, 3_000))]);
  persistQueryCache(client);
  client.getQueryCache().subscribe((event) => {
    if (event.type !== 'updated' || event.query.meta?.session !== true) return;
    const me = event.query.state.data as Me | null | undefined;
    if (me && event.action.type === 'success') adoptSession(client, me);
  });
  window.addEventListener('online', () => {
    forgetCachedAnswers();
    void sendOutbox();
  });
  // Several late copies after one reconnect ask once.
  let refreshAsked = false;
  onCopyAfterReconnect(() => {
    if (refreshAsked) return;
    refreshAsked = true;
    queueMicrotask(() => {
      refreshAsked = false;
      void client.invalidateQueries({ refetchType: 'active' });
    });
  });
  window.addEventListener('offline', () => void sendOutbox());
  document.addEventListener('visibilitychange', () => {
    if (document.visibilityState === 'visible') void sendOutbox();
  });
  if (scope) {
    await reloadOutbox(scope.userId);
    void sendOutbox();
    void askPersistentStorage();
  }
  // The dev server serves no service worker (vite.config.ts: devOptions), so there is none to register.
  if (import.meta.env.PROD) startServiceWorker();
}
