import { expect, test, type Page } from '@playwright/test';
import { RUNNER_PAGES_CACHE } from '../../features/runner/service-worker/cache-names';
import { inviteAndJoin, signIn, uniqueEmail } from './helpers';
import { expectStep, waitUntilKeptOffline } from './offline-helpers';
import { startAllBolts, tapThroughPasses } from './runner-helpers';
import { setUpWheel } from './runner-shop';

const tickAndDone = async (page: Page, step: RegExp) => {
  await expectStep(page, step);
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByRole('button', { name: 'Step done' }).click();
};

test('after one online visit the runner reloads offline, and the parts it loads on demand still open: the bolt-problem form and its photo slot at hand-start, the bead photos at Seat the bead; back online, what was tapped offline is sent', async ({
  page,
  context,
}) => {
  test.setTimeout(150_000);
  const { job, wheelId } = await setUpWheel(page);
  // The very first visit: the page was loaded before the service worker existed.
  await page.goto(`/jobs/${job.id}/wheels/${wheelId}/run`);
  await expectStep(page, /Safety gate/);
  await waitUntilKeptOffline(page);

  await context.setOffline(true);
  await page.reload();
  for (const step of [/Safety gate/, /Clean/, /Inspect rim/, /Mount the tire/, /Index the ring/])
    await tickAndDone(page, step);
  await expectStep(page, /Start every bolt by hand/);

  // Loaded on demand (next/dynamic), never opened online: the precache already holds its chunks.
  const notLoaded = page.getByText(/could not load .*: it needs the Wi-Fi once/);
  await page.getByRole('button', { name: 'Problem with this bolt' }).click();
  const problem = page.getByRole('region', { name: /^Problem with bolt \d+$/ });
  await expect(problem.getByRole('group', { name: 'What is wrong?' })).toBeVisible();
  await expect(problem.getByLabel('Note for the other photo')).toBeVisible();
  await expect(notLoaded).toHaveCount(0);
  await problem.getByRole('button', { name: 'Cancel' }).click();

  await startAllBolts(page);
  await tapThroughPasses(page);
  await expectStep(page, /Seat the bead/);
  await expect(page.getByText('Seated bead, outer face (required)', { exact: true })).toBeVisible();
  await expect(page.getByText('Seated bead, inner face (required)', { exact: true })).toBeVisible();
  await expect(notLoaded).toHaveCount(0);
  await expect(page.getByRole('status').filter({ hasText: /waiting · offline/ })).toBeVisible();

  // Back on the Wi-Fi, the sender (loaded after the paint of the offline reload) sends it all.
  await context.setOffline(false);
  await expect(page.getByRole('status').filter({ hasText: /^Saved$/ })).toBeVisible({
    timeout: 30_000,
  });
});

test('signed out, the next person on the phone gets no runner page from the cache, not even offline', async ({
  page,
  context,
  browser,
}) => {
  test.setTimeout(120_000);
  const { job, wheelId } = await setUpWheel(page);
  const nextEmail = uniqueEmail('next-person');
  const next = await inviteAndJoin(page, browser, nextEmail, 'Noor Next', 'Technician');
  await next.context.close();

  const runner = `/jobs/${job.id}/wheels/${wheelId}/run`;
  await page.goto(runner);
  await expectStep(page, /Safety gate/);
  await waitUntilKeptOffline(page);

  await page.goto('/board');
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  const copies = () =>
    page.evaluate(
      async (name) =>
        (await caches.has(name)) ? (await (await caches.open(name)).keys()).length : 0,
      RUNNER_PAGES_CACHE,
    );
  await expect.poll(copies).toBe(0);

  await signIn(page, nextEmail);
  await expect(page.getByRole('heading', { name: 'My wheels' })).toBeVisible();
  // Offline, the first person's runner is not there to open: no copy of it is left on the phone.
  await context.setOffline(true);
  const opened = await page.goto(runner).then(
    () => 'a page',
    () => 'nothing',
  );
  expect(opened).toBe('nothing');
  await expect(page.getByText(/Safety gate/)).toHaveCount(0);
});
