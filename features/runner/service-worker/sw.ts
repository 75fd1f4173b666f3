/// <reference lib="webworker" />
/**
 * The runner's service worker: a technician reloads the runner while the shop Wi-Fi is down.
 * Built by Serwist inside `next build` (app/runner-sw/[path]/route.ts); served at
 * /runner-sw/sw.js with scope `/`.
 * - The build's files the runner runs on are precached at install, chunks loaded later by
 *   next/dynamic included (the manifest: precache-manifest.ts and runner-files.ts).
 * - Runner pages: network first, the last good copy offline (routes.ts).
 * - On activation the previous build's files go (Serwist), as do our other caches and page
 *   copies the new build cannot run (page-copies.ts).
 * Nothing else is touched: API calls, actions, customer links, photos and other pages pass by.
 */
import { NetworkFirst, Serwist, type PrecacheEntry } from 'serwist';
import { RUNNER_PAGES_CACHE, RUNNER_PRECACHE } from './cache-names';
import { pageCopyStillWorks } from './page-copies';
import {
  isBuildQuery,
  isKeepablePage,
  isRunnerNavigation,
  outdatedCaches,
  pageCopyKey,
  runnerPageFromMessage,
} from './routes';

declare const self: ServiceWorkerGlobalScope & {
  /** Replaced at build time with this build's precache manifest. */
  __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
};
/** When this worker was built (app/runner-sw/[path]/route.ts): every deploy's worker differs. */
declare const __RUNNER_SW_BUILT_AT__: string;

const runnerPages = new NetworkFirst({
  cacheName: RUNNER_PAGES_CACHE,
  plugins: [
    {
      cacheWillUpdate: ({ response }) => (isKeepablePage(response) ? response : null),
      cacheKeyWillBeUsed: ({ request }) => pageCopyKey(request.url),
    },
  ],
});

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  // Named here: Serwist's `cacheId` does not reach the precache's name (it is read first).
  precacheOptions: { cacheName: RUNNER_PRECACHE, cleanupOutdatedCaches: true },
  // A new build takes over at once: the page it serves next is the new build's.
  skipWaiting: true,
  clientsClaim: true,
  runtimeCaching: [
    {
      matcher: ({ request }) => isRunnerNavigation(request, self.location.origin),
      handler: runnerPages,
    },
  ],
});

/** Our caches the new build does not use, and runner page copies it could not run. */
async function dropOutdated() {
  const precacheName = serwist.precacheStrategy.cacheName;
  const names = await caches.keys();
  await Promise.all(
    outdatedCaches(names, [precacheName, RUNNER_PAGES_CACHE]).map((name) => caches.delete(name)),
  );
  const precached = new Set(serwist.getPrecachedUrls().map((url) => new URL(url).pathname));
  const pages = await caches.open(RUNNER_PAGES_CACHE);
  for (const request of await pages.keys()) {
    const copy = await pages.match(request);
    if (!copy || !pageCopyStillWorks(await copy.text(), precached)) await pages.delete(request);
  }
}

self.addEventListener('activate', (event) => event.waitUntil(dropOutdated()));

self.addEventListener('message', (event) => {
  // Which build this phone runs (support, and the deploy test), answered on the port it is given.
  if (isBuildQuery(event.data)) return event.ports[0]?.postMessage(__RUNNER_SW_BUILT_AT__);
  // The page that registers this worker was loaded before the worker was in control (or through
  // the app's own router): it sends its address so the very first visit reloads offline too.
  const page = runnerPageFromMessage(event.data);
  if (!page) return;
  const request = new Request(new URL(page, self.location.origin), { credentials: 'same-origin' });
  event.waitUntil(runnerPages.handle({ event, request }).catch(() => undefined));
});

serwist.addEventListeners();
