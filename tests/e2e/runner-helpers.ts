import { expect, type Locator, type Page } from '@playwright/test';
import { DOUBLE_TAP_MS } from '../../features/runner/double-tap';

/** Starts every bolt by hand in the order the runner suggests, then finishes the step. */
export async function startAllBolts(page: Page) {
  const next = page.getByRole('button', { name: /^Bolt \d+ started by hand$/ });
  while (await next.count()) await next.click();
  await page.getByRole('button', { name: 'All bolts started — step done' }).click();
}

/**
 * The runner drops a confirmation that comes within DOUBLE_TAP_MS of the last one (a gloved thumb
 * bouncing). It judges by the tap event's own time stamp, which Playwright's page clock does not
 * move, so a test taps at human speed in real time: never two confirmations closer than the guard
 * window (plus a margin), counted from when the last tap had been delivered.
 */
const bounce = DOUBLE_TAP_MS + 50;
const lastTapAt = new WeakMap<Page, number>();

/** Taps a confirmation (a bolt, "Turned", "Didn't turn"), spaced past the double-tap guard. */
export async function tapConfirmation(page: Page, button: Locator) {
  const since = Date.now() - (lastTapAt.get(page) ?? 0);
  // Deliberate human-speed spacing, the one fixed wait: the guard is a real-time rule.
  if (since < bounce) await page.waitForTimeout(bounce - since);
  await button.click();
  lastTapAt.set(page, Date.now());
}

/**
 * Works the torque passes as a technician would: "Wrench set" on each setting card, one
 * confirmation per bolt (spaced past the double-tap guard), "Didn't turn" on a check pass. Stops
 * after `bolts` confirmations, or when no pass is left.
 */
export async function confirmBolts(page: Page, bolts = Infinity) {
  const set = page.getByRole('button', { name: 'Wrench set' });
  const confirm = page.getByRole('button', {
    name: /^(Clicked|Reached) — bolt \d+$|^Didn't turn$/,
  });
  let n = 0;
  while (n < bolts) {
    await expect(
      set
        .or(confirm)
        .or(page.getByRole('button', { name: 'Torque passes done' }))
        .first(),
    ).toBeVisible();
    if (await set.count()) {
      await set.click();
      continue;
    }
    if (!(await confirm.count())) break;
    await tapConfirmation(page, confirm.first());
    n++;
  }
}

/** The passes as fast as the runner lets a finger go (just past its double-tap guard): far quicker than a click wrench can be pulled to its click. */
export const tapThroughPasses = async (page: Page) => {
  await confirmBolts(page);
  await page.getByRole('button', { name: 'Torque passes done' }).click();
};

/** Runs a whole wheel as fast as the runner lets a finger go, through to submitting it for sign-off. */
export async function runWheelFast(page: Page, jobId: string, wheelId: string) {
  await page.goto(`/jobs/${jobId}/wheels/${wheelId}/run`);
  const tickAndDone = async (heading: RegExp) => {
    await expect(page.getByRole('heading', { name: heading })).toBeVisible();
    for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
    await page.getByRole('button', { name: 'Step done' }).click();
  };
  await tickAndDone(/Safety gate/);
  await tickAndDone(/Clean/);
  await tickAndDone(/Inspect rim/);
  await tickAndDone(/Mount the tire/);
  await tickAndDone(/Index the ring/);
  await startAllBolts(page);
  await tapThroughPasses(page);

  await expect(page.getByRole('heading', { name: /Seat the bead/ })).toBeVisible();
  const jpeg = await page.evaluate(async () => {
    const c = document.createElement('canvas');
    c.width = 1200;
    c.height = 800;
    const g = c.getContext('2d')!;
    g.fillStyle = '#333';
    g.fillRect(0, 0, c.width, c.height);
    const blob = await new Promise<Blob>((r) => c.toBlob((b) => r(b!), 'image/jpeg', 0.9));
    return Array.from(new Uint8Array(await blob.arrayBuffer()));
  });
  const photo = { name: 'bead.jpg', mimeType: 'image/jpeg', buffer: Buffer.from(jpeg) };
  await page
    .getByLabel('Take or choose a photo — Seated bead, outer face (required)')
    .setInputFiles(photo);
  await expect(page.getByRole('img', { name: 'Seated bead, outer face' })).toBeVisible({
    timeout: 20_000,
  });
  await page
    .getByLabel('Take or choose a photo — Seated bead, inner face (required)')
    .setInputFiles(photo);
  await expect(page.getByRole('img', { name: 'Seated bead, inner face' })).toBeVisible({
    timeout: 20_000,
  });
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByLabel('Highest pressure used to seat the bead').fill('22');
  await page.getByRole('button', { name: 'Step done' }).click();
  await expect(page.getByRole('heading', { name: /Leak check/ })).toBeVisible();
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByLabel('Pressure set').fill('8');
  await page.getByRole('button', { name: 'Step done' }).click();
  await page.getByRole('button', { name: 'Submit the wheel' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'the job card went to sign-off' }),
  ).toBeVisible();
}
