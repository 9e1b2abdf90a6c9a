// Shared by the service worker (apps/web/sw) and the app, so both name the same cache and headers.

/** The Cache Storage cache of API answers; the app deletes it at sign-out. */
export const API_CACHE = 'heatfleet-api';
/** Sent by the app with every API read: whose answer it is (person and firm). */
export const SCOPE_HEADER = 'X-Heatfleet-Scope';
/** Set by the service worker on an answer taken from its cache. */
export const FROM_CACHE_HEADER = 'X-Heatfleet-From-Cache';

/** API reads worth keeping for offline use: not the session's token, not the dev-only mail catcher. */
export function isCachedApiPath(pathname: string): boolean {
  return pathname.startsWith('/api/') && !pathname.startsWith('/api/auth/') && !pathname.startsWith('/api/outbox');
}
