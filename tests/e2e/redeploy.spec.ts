import { expect, test } from '@playwright/test';
import { readFileSync } from 'node:fs';
import { serverActionId } from '../helpers/next-build';
import { E2E } from '../helpers/test-services';
import { setUpWheel } from './runner-shop';

// This test stops the server and builds the app a second time (about 30 s on an idle machine, a
// few minutes on a busy one). Its project ('redeploy') runs after every other test, so no other test
// meets the server down; it is skipped when an earlier test failed. Alone:
// `npx playwright test redeploy.spec.ts --no-deps` (with its dependencies it runs the whole suite).

test('a confirmation queued before a deploy is delivered to the new build', async ({
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
  const actionBefore = serverActionId(E2E.distDir, 'saveWheelEvents');

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
  // The trap itself: the page still holds the old build's action id, which the new build lacks.
  expect(serverActionId(E2E.distDir, 'saveWheelEvents')).not.toBe(actionBefore);

  await context.setOffline(false);
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible({
    timeout: 20_000,
  });
  const { events } = (await (await page.request.get(`/api/wheels/${wheelId}/events`)).json())
    .data as { events: { type: string; payload: { step?: string } }[] };
  expect(events.map((e) => `${e.type}:${e.payload.step}`)).toEqual(['step_done:safety']);
  await page.reload();
  await expect(page.getByRole('heading', { name: /Clean and deburr/ })).toBeVisible();
});
