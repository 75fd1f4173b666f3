// Ringpass runner service worker: lets a technician reload the runner while the shop Wi-Fi is
// down. Runner pages: network first, the last good copy when offline. Build assets: cache first
// (their names change with every build). Nothing else is touched.
// The sign-in page deletes PAGES (features/runner/components/forget-runner-pages.tsx): a copy
// rendered for one person is never shown to the next.
const PAGES = 'ringpass-runner-pages-v1';
const ASSETS = 'ringpass-runner-assets-v1';
const RUNNER = /^\/jobs\/[^/]+\/wheels\/[^/]+\/run\/?$/;

self.addEventListener('install', () => self.skipWaiting());
self.addEventListener('activate', (event) => event.waitUntil(self.clients.claim()));

// The page that registered us was loaded before we were in control: it sends its own address and
// the assets it loaded, so the very first visit can already be reloaded offline.
self.addEventListener('message', (event) => {
  const { type, page, assets } = event.data ?? {};
  if (type !== 'cache-runner' || typeof page !== 'string' || !RUNNER.test(page)) return;
  const sameOrigin = (Array.isArray(assets) ? assets : []).filter(
    (a) =>
      typeof a === 'string' && new URL(a, self.location.origin).origin === self.location.origin,
  );
  event.waitUntil(
    Promise.all([
      caches.open(PAGES).then(async (cache) => {
        const response = await fetch(page, { credentials: 'same-origin' });
        if (response.ok && !response.redirected) await cache.put(page, response);
      }),
      caches
        .open(ASSETS)
        .then((cache) =>
          cache.addAll(
            sameOrigin.filter((a) =>
              new URL(a, self.location.origin).pathname.startsWith('/_next/static/'),
            ),
          ),
        ),
    ]).catch(() => {}),
  );
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;

  if (request.mode === 'navigate' && RUNNER.test(url.pathname)) {
    event.respondWith(
      fetch(request)
        .then((response) => {
          if (response.ok && !response.redirected) {
            const copy = response.clone();
            void caches.open(PAGES).then((cache) => cache.put(url.pathname, copy));
          }
          return response;
        })
        .catch(
          async () => (await caches.match(url.pathname, { cacheName: PAGES })) ?? Response.error(),
        ),
    );
    return;
  }

  if (
    url.pathname.startsWith('/_next/static/') ||
    url.pathname.startsWith('/__nextjs_font/') ||
    url.pathname === '/icon.svg'
  ) {
    event.respondWith(
      caches.open(ASSETS).then(async (cache) => {
        const hit = await cache.match(request);
        if (hit) return hit;
        const response = await fetch(request);
        if (response.ok) void cache.put(request, response.clone());
        return response;
      }),
    );
  }
});
