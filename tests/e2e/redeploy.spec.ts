import { expect, test } from '@playwright/test';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { RUNNER_PAGES_CACHE } from '../../features/runner/service-worker/cache-names';
import { E2E } from '../helpers/test-services';
import { cacheContents, waitUntilKeptOffline, workerBuild } from './offline-helpers';
import { setUpWheel } from './runner-shop';

// This test stops the server and builds the app a second time (about 30 s on an idle machine, a
// few minutes on a busy one). Its project ('redeploy') runs after every other test, so no other test
// meets the server down; it is skipped when an earlier test failed. Alone:
// `npx playwright test redeploy.spec.ts --no-deps` (with its dependencies it runs the whole suite).

test('a confirmation queued before a deploy is delivered to the new build, whose service worker clears what the old build left on the phone and reloads the runner offline', async ({
  page,
  context,
}) => {
  test.setTimeout(480_000);
  const { job, wheelId } = await setUpWheel(page);
  await page.goto(`/jobs/${job.id}/wheels/${wheelId}/run`);
  await expect(page.getByRole('heading', { name: /Safety gate/ })).toBeVisible();
  await page.waitForFunction(async () =>
    Boolean((await navigator.serviceWorker.getRegistration())?.active),
  );
  const buildBefore = readFileSync(`${E2E.distDir}/BUILD_ID`, 'utf8');
  await waitUntilKeptOffline(page);
  const workerBefore = await workerBuild(page);
  // What a phone keeps from an earlier build: a file only that build had (this rebuild compiles
  // the same sources, whose chunks keep their names, so one is planted), the hand-written worker's
  // asset cache of the release before Serwist, and a runner page that build rendered.
  const OLD_CHUNK = '/_next/static/chunks/previous-build.js';
  const OLD_PAGE = '/jobs/earlier/wheels/earlier/run';
  await page.evaluate(
    async ({ chunk, oldPage, pagesCache }) => {
      const precache = (await caches.keys()).find((name) => name.includes('-precache-'))!;
      await (await caches.open(precache)).put(chunk, new Response('/* an earlier build */'));
      await (await caches.open('ringpass-runner-assets-v1')).put(chunk, new Response('/* */'));
      const html = `<html><body><script src="${chunk}"></script></body></html>`;
      const headers = { 'content-type': 'text/html' };
      await (await caches.open(pagesCache)).put(oldPage, new Response(html, { headers }));
    },
    { chunk: OLD_CHUNK, oldPage: OLD_PAGE, pagesCache: RUNNER_PAGES_CACHE },
  );

  await context.setOffline(true);
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByRole('button', { name: 'Step done' }).click();
  await expect(page.getByRole('status').filter({ hasText: '1 waiting · offline' })).toBeVisible();

  // Deploy: the server stops, a new build is made, the server starts again on it.
  process.kill(Number(readFileSync(E2E.servePidFile, 'utf8')), 'SIGUSR2');
  await expect
    .poll(
      async () => {
        try {
          const buildNow = readFileSync(`${E2E.distDir}/BUILD_ID`, 'utf8');
          const up = (await fetch(`${new URL(page.url()).origin}/sign-in`)).ok;
          return up && buildNow !== buildBefore;
        } catch {
          return false;
        }
      },
      { timeout: 420_000, intervals: [1000] },
    )
    .toBe(true);
  // The page is still the old build's; it sends to the runner's stable address
  // (POST /api/wheels/:id/events), which the new build answers as the old one did.

  await context.setOffline(false);
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible({
    timeout: 20_000,
  });
  const { events } = (await (await page.request.get(`/api/wheels/${wheelId}/events`)).json())
    .data as { events: { type: string; payload: { step?: string } }[] };
  expect(events.map((e) => `${e.type}:${e.payload.step}`)).toEqual(['step_done:safety']);
  await page.reload();
  await expect(page.getByRole('heading', { name: /Clean and deburr/ })).toBeVisible();

  // The new build's worker took over; on activation it removed the earlier build's leftovers.
  await expect
    .poll(() => workerBuild(page), { timeout: 30_000 })
    .not.toMatch(new RegExp(`^(${workerBefore}|no answer)$`));
  // It answers while still activating: its clean-up is done once it is 'activated'.
  await expect
    .poll(
      () => page.evaluate(async () => (await navigator.serviceWorker.ready).active?.state ?? null),
      { timeout: 30_000 },
    )
    .toBe('activated');
  await waitUntilKeptOffline(page);
  const kept = await cacheContents(page);
  expect(Object.keys(kept)).not.toContain('ringpass-runner-assets-v1');
  const files = Object.values(kept).flat();
  expect(files).not.toContain(OLD_CHUNK);
  expect(kept[RUNNER_PAGES_CACHE]).toEqual([new URL(page.url()).pathname]);
  // Every build file left on the phone is one the new build serves.
  const buildFiles = files.filter((file) => file.startsWith('/_next/static/'));
  expect(buildFiles.length).toBeGreaterThan(0);
  for (const file of buildFiles)
    expect(existsSync(path.join(E2E.distDir, file.slice('/_next/'.length))), file).toBe(true);

  // And the runner still reloads without Wi-Fi, on the new build.
  await context.setOffline(true);
  await page.reload();
  await expect(page.getByRole('heading', { name: /Clean and deburr/ })).toBeVisible();
  await context.setOffline(false);
});
