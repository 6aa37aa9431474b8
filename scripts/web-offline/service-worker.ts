/**
 * Crestwatch's service worker: the source the web build bundles (esbuild) and into which
 * workbox-build's injectManifest writes the precache list (scripts/web-offline/build.ts).
 *
 * - App shell: every exported page, script, style, icon and the Latin font files are
 *   precached; a page is answered from that copy, mapped from its URL the way the server
 *   maps it (api/web/static-routes.ts), so any screen opens without a network.
 * - Other font subsets (Latin Extended, Greek, Cyrillic) are kept once a page used them:
 *   a page downloads only the subsets it shows.
 * - API answers of the region (with the district list and the tracks) and of the last CARD_LIMIT district cards: network first, so
 *   a publish shows at once; read from the cache only when the network fails, marked with
 *   OFFLINE_COPY_HEADER; at most a week old. Only 200 answers are kept. A 401 on any API
 *   request deletes them all (the app also deletes them at sign-out).
 * - Nothing else under /api is kept, and no state-changing request is touched (the app
 *   refuses those while offline instead of queuing them).
 * - A new build installs in the background and waits; the next visit (a navigation while
 *   this is the only open window) hands over to it and reloads, and the app says so.
 */
import { CacheableResponsePlugin } from 'workbox-cacheable-response';
import { clientsClaim, type WorkboxPlugin } from 'workbox-core';
import { ExpirationPlugin } from 'workbox-expiration';
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute, type PrecacheEntry } from 'workbox-precaching';
import { registerRoute } from 'workbox-routing';
import { CacheFirst, NetworkFirst, NetworkOnly } from 'workbox-strategies';

import {
  API_CACHES,
  CARD_LIMIT,
  clearOfflineCopies,
  OFFLINE_COPY_HEADER,
  OFFLINE_MAX_AGE_SECONDS,
  SW_MESSAGES,
} from '../../lib/offline-copies';

/** [URL pattern, exported HTML file] of every page, most specific first (written by the build). */
declare const CW_HTML_ROUTES: [string, string][];
/** The build this worker belongs to (written by the build). */
declare const CW_BUILD_VERSION: string;

/** The parts of the worker's global scope used here (the app's TypeScript has no WebWorker lib). */
interface WorkerScope {
  location: Location;
  registration: { waiting: { postMessage(message: unknown): void } | null };
  clients: { matchAll(options: { type: 'window' }): Promise<unknown[]> };
  skipWaiting(): Promise<void>;
  addEventListener(
    type: 'message',
    listener: (event: {
      data: unknown;
      ports: readonly MessagePort[];
      waitUntil(promise: Promise<unknown>): void;
    }) => void,
  ): void;
}

const sw = self as unknown as WorkerScope;
const FONT_CACHE = 'crestwatch-fonts';

// ---- App shell -----------------------------------------------------------------------------

// No directory index or clean-URL guessing: navigations are mapped below, as the server does.
precacheAndRoute((self as unknown as { __WB_MANIFEST: PrecacheEntry[] }).__WB_MANIFEST, {
  directoryIndex: '',
  cleanURLs: false,
});
cleanupOutdatedCaches();
clientsClaim();

const sameOrigin = (url: URL) => url.origin === sw.location.origin;
const htmlRoutes = CW_HTML_ROUTES.map(([pattern, file]) => ({ pattern: new RegExp(pattern), file }));

/** A page that reloads itself at once (used to hand over to a waiting build). */
function reloadPage(): Response {
  return new Response('<!doctype html><meta http-equiv="refresh" content="0"><title>Crestwatch</title>', {
    headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store' },
  });
}

async function answerNavigation({ request, url }: { request: Request; url: URL }): Promise<Response> {
  const waiting = sw.registration.waiting;
  if (waiting && (await sw.clients.matchAll({ type: 'window' })).length <= 1) {
    waiting.postMessage({ type: SW_MESSAGES.activate });
    return reloadPage();
  }
  let path = url.pathname;
  try {
    path = decodeURIComponent(path);
  } catch {
    // A malformed escape: match the path as sent.
  }
  const hit = htmlRoutes.find((r) => r.pattern.test(path));
  const kept = hit ? await matchPrecache(`/${hit.file}`) : undefined;
  if (kept) return kept;
  try {
    return await fetch(request);
  } catch (err) {
    const notFound = await matchPrecache('/+not-found.html');
    if (notFound) return notFound;
    throw err;
  }
}

registerRoute(
  ({ request, url }) => request.mode === 'navigate' && sameOrigin(url) && !url.pathname.startsWith('/api/'),
  answerNavigation,
);

registerRoute(
  ({ url }) => sameOrigin(url) && url.pathname.startsWith('/fonts/'),
  new CacheFirst({
    cacheName: FONT_CACHE,
    plugins: [new CacheableResponsePlugin({ statuses: [200] }), new ExpirationPlugin({ maxEntries: 24 })],
  }),
);

// ---- API answers ---------------------------------------------------------------------------

/** A 401 means nobody is signed in here any more: forget every kept answer. */
const forgetOnSignedOut: WorkboxPlugin = {
  fetchDidSucceed: async ({ response }) => {
    if (response.status === 401) await clearOfflineCopies();
    return response;
  },
};

/** An answer read from the cache says so, with the date the server sent it. */
const markOfflineCopy: WorkboxPlugin = {
  cachedResponseWillBeUsed: async ({ cachedResponse }) => {
    const sentAt = cachedResponse?.headers.get('date');
    if (!cachedResponse || !sentAt) return cachedResponse ?? null;
    const headers = new Headers(cachedResponse.headers);
    headers.delete('content-encoding');
    headers.delete('content-length');
    headers.set(OFFLINE_COPY_HEADER, sentAt);
    return new Response(await cachedResponse.blob(), {
      status: cachedResponse.status,
      statusText: cachedResponse.statusText,
      headers,
    });
  },
};

function keepForOffline(pattern: RegExp, cacheName: string, maxEntries: number): void {
  registerRoute(
    ({ url, request }) => sameOrigin(url) && request.mode !== 'navigate' && pattern.test(url.pathname),
    new NetworkFirst({
      cacheName,
      plugins: [
        new CacheableResponsePlugin({ statuses: [200] }),
        new ExpirationPlugin({ maxEntries, maxAgeSeconds: OFFLINE_MAX_AGE_SECONDS, purgeOnQuotaError: true }),
        markOfflineCopy,
        forgetOnSignedOut,
      ],
    }),
  );
}

// The region answer, the district list and the watched tracks behind the region screens
// (without the tracks the switcher would wait for them offline), and the map's shapes.
keepForOffline(/^\/api\/(region|districts|tracks)$/, API_CACHES.region, 3);
keepForOffline(/^\/api\/boundaries$/, API_CACHES.boundaries, 2);
// The district cards: estimate, yearly series and history of the last CARD_LIMIT opened.
keepForOffline(/^\/api\/districts\/[^/]+\/estimate$/, API_CACHES.cardEstimate, CARD_LIMIT);
keepForOffline(/^\/api\/districts\/[^/]+$/, API_CACHES.cardDetail, CARD_LIMIT);
keepForOffline(/^\/api\/districts\/[^/]+\/history$/, API_CACHES.cardHistory, CARD_LIMIT);

// Every other API read goes to the network only, still watched for a 401.
registerRoute(
  ({ url, request }) => sameOrigin(url) && request.mode !== 'navigate' && url.pathname.startsWith('/api/'),
  new NetworkOnly({ plugins: [forgetOnSignedOut] }),
);

// ---- Messages from the app ----------------------------------------------------------------

sw.addEventListener('message', (event) => {
  const type = (event.data as { type?: unknown } | null)?.type;
  if (type === SW_MESSAGES.activate) void sw.skipWaiting();
  else if (type === SW_MESSAGES.clearApi) event.waitUntil(clearOfflineCopies());
  else if (type === SW_MESSAGES.version) event.ports[0]?.postMessage({ version: CW_BUILD_VERSION });
});
