import { clientsClaim } from 'workbox-core';
import { ExpirationPlugin } from 'workbox-expiration';
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { NetworkFirst } from 'workbox-strategies';
import { API_CACHE, FROM_CACHE_HEADER, SCOPE_HEADER, isCachedApiPath } from '../src/lib/offline/api-cache-rules.ts';

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: (string | { url: string; revision: string | null })[] };

// The app shell (index.html, scripts, styles, fonts, icons) from the build's manifest, so the app opens with no signal.
cleanupOutdatedCaches();
precacheAndRoute(self.__WB_MANIFEST);
// Every page of the single-page app is index.html; /api is never a page.
registerRoute(new NavigationRoute(createHandlerBoundToURL('/index.html'), { denylist: [/^\/api\//] }));

/**
 * API reads, network first with the last answer as the fallback. The cache key carries the person and firm the
 * app sent (SCOPE_HEADER), so one person's or firm's answers are never shown to another on the same phone; a
 * read without it (an <img>, a download) is not cached. Writes never reach this route: only GET is registered.
 */
registerRoute(
  ({ request, url }) =>
    url.origin === self.location.origin && request.headers.has(SCOPE_HEADER) && isCachedApiPath(url.pathname),
  new NetworkFirst({
    cacheName: API_CACHE,
    networkTimeoutSeconds: 6,
    plugins: [
      {
        cacheKeyWillBeUsed: async ({ request }) => {
          const url = new URL(request.url);
          url.searchParams.set('__scope', request.headers.get(SCOPE_HEADER) ?? '');
          return url.href;
        },
        cacheWillUpdate: async ({ response }) => (response.status === 200 ? response : null),
        // Marks an answer from the cache, so the app can say "as of" (its Date header says when it was fetched).
        cachedResponseWillBeUsed: async ({ cachedResponse }) => {
          if (!cachedResponse) return null;
          const headers = new Headers(cachedResponse.headers);
          headers.set(FROM_CACHE_HEADER, '1');
          return new Response(cachedResponse.body, { status: cachedResponse.status, headers });
        },
      },
      new ExpirationPlugin({ maxEntries: 400, maxAgeSeconds: 7 * 86_400 }),
    ],
  }),
  'GET',
);

// A new version waits until the engineer taps "Update" (the app posts SKIP_WAITING), never mid-job.
self.addEventListener('message', (event) => {
  if ((event.data as { type?: string } | null)?.type === 'SKIP_WAITING') void self.skipWaiting();
});
// The first version takes charge of the open page at once, so the page that installed it works offline.
clientsClaim();
