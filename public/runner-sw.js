// Retired. The runner's first service worker lived at this address; the runner now registers
// /runner-sw/sw.js (features/runner/service-worker/sw.ts). A phone that still has the old worker
// fetches this file on its next update check: this version deletes what the old one kept (about
// 1 MB of runner pages and build files) and unregisters itself, unless the runner's current worker
// is already taking over the same registration (then it touches nothing: that worker cleans up).
self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      // The runner's current worker may be filling its own cache in this registration right now:
      // leave everything to it (its activation drops what the old worker kept).
      const registration = self.registration;
      const successor = [registration.installing, registration.waiting].some(
        (worker) => worker && !new URL(worker.scriptURL).pathname.endsWith('/runner-sw.js'),
      );
      if (successor) return;
      const names = await caches.keys();
      await Promise.all(
        names
          .filter((name) => name.startsWith('ringpass-runner-'))
          .map((name) => caches.delete(name)),
      );
      await registration.unregister();
    })(),
  );
});
