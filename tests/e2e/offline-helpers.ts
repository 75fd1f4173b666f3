import { expect, type Page } from '@playwright/test';
import { RUNNER_PAGES_CACHE } from '../../features/runner/service-worker/cache-names';
import { buildCodeIn } from '../../features/runner/service-worker/page-copies';
import { BUILD_QUERY } from '../../features/runner/service-worker/routes';

/**
 * Waits until this runner page would reload without Wi-Fi: a service worker controls it and
 * holds a copy of the page and every script and style that copy names. (Scripts an earlier page
 * loaded before the app's router moved here are not needed by a reload, and not asked for.)
 */
export async function waitUntilKeptOffline(page: Page) {
  // expect.poll, not page.waitForFunction: that one takes a predicate's Promise as its truthy
  // answer and stops waiting at once.
  await expect
    .poll(
      async () => {
        const copy = await page.evaluate(async (pagesCache) => {
          if (!navigator.serviceWorker.controller) return null;
          const kept = await caches.match(location.pathname, { cacheName: pagesCache });
          return kept ? kept.text() : null;
        }, RUNNER_PAGES_CACHE);
        if (copy === null) return 'no copy of the page under a worker in control';
        const code = buildCodeIn(copy);
        const missing = await page.evaluate(async (paths) => {
          const held = await Promise.all(paths.map((p) => caches.match(p)));
          return paths.filter((_, i) => !held[i]);
        }, code);
        return code.length && !missing.length ? 'kept' : `not cached: ${missing.join(' ')}`;
      },
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
