import { expect, type Page } from '@playwright/test';
import { RUNNER_PAGES_CACHE } from '../../features/runner/service-worker/cache-names';
import { BUILD_QUERY } from '../../features/runner/service-worker/routes';

/**
 * Waits until this runner page would reload without Wi-Fi: the service worker controls it, holds
 * a copy of the page, and every script and style the page has loaded is in a cache.
 */
export async function waitUntilKeptOffline(page: Page) {
  // expect.poll, not page.waitForFunction: that one takes a predicate's Promise as its truthy
  // answer and stops waiting at once.
  await expect
    .poll(
      () =>
        page.evaluate(async (pagesCache) => {
          if (!navigator.serviceWorker.controller) return 'no worker in control';
          if (!(await caches.match(location.pathname, { cacheName: pagesCache })))
            return 'no copy of the page';
          const code = [
            ...[...document.scripts].map((s) => s.src),
            ...[...document.querySelectorAll<HTMLLinkElement>('link[rel=stylesheet]')].map(
              (l) => l.href,
            ),
          ].filter((src) => src && new URL(src).pathname.startsWith('/_next/static/'));
          const held = await Promise.all(code.map((src) => caches.match(src)));
          const missing = code.filter((_, i) => !held[i]);
          return code.length && !missing.length ? 'kept' : `not cached: ${missing.join(' ')}`;
        }, RUNNER_PAGES_CACHE),
      { timeout: 30_000 },
    )
    .toBe('kept');
}

/** When the service worker now in charge was built (each deploy's worker answers differently). */
export async function workerBuild(page: Page): Promise<string> {
  return page.evaluate(async (query) => {
    const registration = await navigator.serviceWorker.ready;
    const channel = new MessageChannel();
    const answer = new Promise<string>((resolve) => {
      channel.port1.onmessage = (event) => resolve(String(event.data));
    });
    registration.active!.postMessage(query, [channel.port2]);
    // A worker being replaced may never answer: ask again (expect.poll) rather than hang.
    const noAnswer = new Promise<string>((resolve) => setTimeout(() => resolve('no answer'), 2000));
    return Promise.race([answer, noAnswer]);
  }, BUILD_QUERY);
}

/** Every cache's name and the paths it holds. */
export async function cacheContents(page: Page): Promise<Record<string, string[]>> {
  return page.evaluate(async () => {
    const out: Record<string, string[]> = {};
    for (const name of await caches.keys()) {
      const cache = await caches.open(name);
      out[name] = (await cache.keys()).map((r) => new URL(r.url).pathname);
    }
    return out;
  });
}

/** Waits for the runner's heading of a step (the step panel's h2, e.g. /Seat the bead/). */
export const expectStep = (page: Page, name: RegExp) =>
  expect(page.getByRole('heading', { name })).toBeVisible();
