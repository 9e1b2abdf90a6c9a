import { useSyncExternalStore } from 'react';
import { registerSW } from 'virtual:pwa-register';

let updateReady = false;
let applyUpdateNow: ((reloadPage?: boolean) => Promise<void>) | null = null;
const listeners = new Set<() => void>();

/**
 * Registers the service worker (apps/web/sw). A new version downloads in the background and waits: the app offers
 * it ("Update when you are ready") and never reloads by itself, so nothing is interrupted in the middle of a job.
 * Checked again every hour for a phone that stays open all day.
 */
export function startServiceWorker(): void {
  if (applyUpdateNow || !('serviceWorker' in navigator)) return;
  applyUpdateNow = registerSW({
    immediate: true,
    onNeedRefresh() {
      updateReady = true;
      for (const listener of listeners) listener();
    },
    onRegisteredSW(_url, registration) {
      if (registration) setInterval(() => void registration.update().catch(() => undefined), 60 * 60_000);
    },
  });
}

export function useUpdateReady(): boolean {
  return useSyncExternalStore(
    (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    () => updateReady,
  );
}

/** The engineer chose to update: the new version takes over and the page reloads into it. */
export function applyUpdate(): void {
  void applyUpdateNow?.(true);
}
