import { expect, test } from '@playwright/test';
import { expectNoSideScroll, PASSWORD } from './helpers';
import { waitUntilKeptOffline } from './offline-helpers';
import { confirmBolts, startAllBolts } from './runner-helpers';
import { api, BLUE, setUpWheel } from './runner-shop';

test('at 360×640 a wheel runs through its steps; offline, 10 bolts are confirmed, the page reloads offline, and back online exactly those 10 are stored, in order', async ({
  page,
  context,
}, testInfo) => {
  test.setTimeout(120_000);
  const { job, wheelId } = await setUpWheel(page);

  await page.goto(`/jobs/${job.id}`);
  await page.getByRole('link', { name: 'Run this wheel' }).click();
  await expect(page.getByRole('heading', { name: /Safety gate/ })).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Caution' })).toContainText(
    'valve core out',
  );

  const tickAndDone = async () => {
    for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
    await page.getByRole('button', { name: 'Step done' }).click();
  };
  await tickAndDone(); // safety
  await expect(page.getByRole('heading', { name: /Clean and deburr/ })).toBeVisible();
  await page.getByRole('button', { name: 'Skip this step…' }).click(); // clean
  await page.getByLabel('Why skip this step?').fill('New wheel, clean from the box');
  await page.getByRole('button', { name: 'Skip the step' }).click();
  await expect(page.getByRole('heading', { name: /Inspect rim, ring and bolts/ })).toBeVisible();
  await tickAndDone(); // inspect
  await expect(
    page.getByText('Left side: standing outside the wheel, the arrow turns counterclockwise'),
  ).toBeVisible();
  await tickAndDone(); // mount
  await tickAndDone(); // index
  await expect(page.getByRole('heading', { name: /Start every bolt by hand/ })).toBeVisible();
  await startAllBolts(page);

  await expect(page.getByText('Set Blue click 20–200 in-lb to 43 in-lb')).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();
  // Offline reload works once the service worker holds this page and the scripts it runs on.
  await waitUntilKeptOffline(page);
  await expectNoSideScroll(page);
  await testInfo.attach('a pass', { body: await page.screenshot(), contentType: 'image/png' });
  await page.getByRole('button', { name: 'Wrench set' }).click();
  // The phone turned on its side: nothing scrolls sideways, and below the sticky header the ring and
  // the button are in view together.
  await page.setViewportSize({ width: 640, height: 360 });
  await expectNoSideScroll(page);
  const ring = page.getByRole('group', { name: /^Bolt circle, pass 1/ });
  const header = (await page.getByRole('banner').boundingBox())!;
  await page.evaluate(
    (by) => window.scrollBy(0, by),
    (await ring.boundingBox())!.y - (header.y + header.height),
  );
  const below = header.y + header.height;
  for (const part of [ring, page.getByRole('button', { name: /^Clicked — bolt \d+$/ })]) {
    const box = (await part.boundingBox())!;
    expect(box.y, 'not under the header').toBeGreaterThanOrEqual(below - 1);
    expect(box.y + box.height, 'on the screen').toBeLessThanOrEqual(360);
  }
  await testInfo.attach('a pass, landscape', {
    body: await page.screenshot(),
    contentType: 'image/png',
  });
  await page.setViewportSize({ width: 360, height: 640 });
  // Pass 1's "Wrench set" recorded the wrench chosen; it reached the server before the Wi-Fi drops.
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();

  await context.setOffline(true);
  await confirmBolts(page, 10);
  // 10 bolts and pass 2's "Wrench set" (the wrench chosen for the pass): 11 events wait.
  await expect(page.getByRole('status').filter({ hasText: '11 waiting · offline' })).toBeVisible();
  await page.reload();
  await expect(page.getByText('Set Blue click 20–200 in-lb to 101 in-lb')).toBeVisible(); // pass 2, resumed
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await expect(page.getByText('2 of 8 bolts · next: bolt 3')).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: '11 waiting' })).toBeVisible(); // the wrench is not chosen twice

  await context.setOffline(false);
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible({
    timeout: 15_000,
  });
  const { events } = await api<{
    events: { type: string; payload: { pass?: number; bolt?: number } }[];
  }>(page, 'GET', `/api/wheels/${wheelId}/events`);
  const bolts = events
    .filter((e) => e.type === 'bolt_confirmed')
    .map((e) => `${e.payload.pass}:${e.payload.bolt}`);
  expect(bolts).toEqual(['1:1', '1:5', '1:3', '1:7', '1:2', '1:6', '1:4', '1:8', '2:1', '2:5']);

  // Finish the wheel: the rest of pass 2, pass 3, the check pass.
  await confirmBolts(page);
  await page.getByRole('button', { name: 'Torque passes done' }).click();

  // Seat the bead: cautions, the pressure limit, two photos through the local upload fake.
  await expect(page.getByRole('heading', { name: /Seat the bead/ })).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Caution' })).toContainText(
    'maximum bead-seating pressure',
  );
  const jpeg = await page.evaluate(async () => {
    const c = document.createElement('canvas');
    c.width = 2400;
    c.height = 1600;
    const g = c.getContext('2d')!;
    g.fillStyle = '#333';
    g.fillRect(0, 0, c.width, c.height);
    g.fillStyle = '#ffb300';
    g.beginPath();
    g.arc(1200, 800, 600, 0, Math.PI * 2);
    g.fill();
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
  // A text file named like a photo is refused by its bytes.
  await page.getByLabel('Take or choose a photo — Other photo', { exact: true }).setInputFiles({
    name: 'notes.jpg',
    mimeType: 'image/jpeg',
    buffer: Buffer.from('not a photo at all'),
  });
  await expect(
    page.getByRole('alert').filter({ hasText: 'not a JPEG, PNG or WebP photo' }),
  ).toBeVisible({ timeout: 20_000 });
  await expectNoSideScroll(page);
  await testInfo.attach('bead photos', {
    body: await page.screenshot({ fullPage: true }),
    contentType: 'image/png',
  });

  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByLabel('Highest pressure used to seat the bead').fill('45');
  await expect(
    page
      .getByRole('alert')
      .filter({ hasText: "Above the tire's maximum bead-seating pressure (30 psi)" }),
  ).toBeVisible();
  await expect(page.getByRole('button', { name: 'Step done' })).toBeDisabled();
  await page.getByLabel('Highest pressure used to seat the bead').fill('22');
  await page.getByRole('button', { name: 'Step done' }).click();

  await expect(page.getByRole('heading', { name: /Leak check/ })).toBeVisible();
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByLabel('Pressure set').fill('8');
  await page.getByRole('button', { name: 'Step done' }).click();

  await expect(page.getByRole('heading', { name: /Submit the wheel/ })).toBeVisible();
  await expect(page.getByText('None: every bolt in sequence.')).toBeVisible();
  await expect(
    page.getByText(/Clean and deburr: skipped \(New wheel, clean from the box\)/),
  ).toBeVisible();
  await expectNoSideScroll(page);
  await testInfo.attach('summary', {
    body: await page.screenshot({ fullPage: true }),
    contentType: 'image/png',
  });
  await page.getByRole('button', { name: 'Submit the wheel' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'the job card went to sign-off' }),
  ).toBeVisible();
  await page.goto(`/jobs/${job.id}`);
  await expect(page.getByText('Awaiting sign-off').first()).toBeVisible();
  await expect(page.getByRole('img', { name: 'Seated bead, outer face' })).toBeVisible();
});

test('a session that ends mid-wheel keeps the confirmation; signing in again comes back to the runner and sends it', async ({
  page,
  context,
}) => {
  const { job, wheelId, email } = await setUpWheel(page);
  await page.goto(`/jobs/${job.id}/wheels/${wheelId}/run`);
  await expect(page.getByRole('heading', { name: /Safety gate/ })).toBeVisible();

  await context.clearCookies(); // the session ends (expired, or a lead changed the role)
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByRole('button', { name: 'Step done' }).click();
  await expect(
    page
      .getByRole('alert')
      .filter({ hasText: 'Your session has ended. Everything waiting stays on this phone.' }),
  ).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: '1 waiting' })).toBeVisible();

  await page.getByRole('link', { name: 'Sign in again' }).click();
  await expect(
    page.getByText('Sign in to go back to where you were. Nothing waiting on this device is lost.'),
  ).toBeVisible();
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(new RegExp(`/jobs/${job.id}/wheels/${wheelId}/run$`));
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();
  await expect(page.getByRole('heading', { name: /Clean and deburr/ })).toBeVisible();
  const { events } = (await (await page.request.get(`/api/wheels/${wheelId}/events`)).json())
    .data as { events: { type: string; payload: { step?: string } }[] };
  expect(events.map((e) => `${e.type}:${e.payload.step}`)).toEqual(['step_done:safety']);
});

test('a save that fails in flight (Wi-Fi up, no route to the server) waits and goes on the retry', async ({
  page,
}) => {
  const { job, wheelId } = await setUpWheel(page);
  const runner = `/jobs/${job.id}/wheels/${wheelId}/run`;
  await page.goto(runner);
  await expect(page.getByRole('heading', { name: /Safety gate/ })).toBeVisible();

  // The phone still believes it is online; every save to the server fails at the network (the
  // runner's other phones' poll, a GET to the same address, passes).
  const saves = (url: URL) => url.pathname === `/api/wheels/${wheelId}/events`;
  await page.route(saves, (route) =>
    route.request().method() === 'POST' ? route.abort('internetdisconnected') : route.continue(),
  );
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByRole('button', { name: 'Step done' }).click();
  await expect(page.getByRole('status').filter({ hasText: /^1 waiting$/ })).toBeVisible();
  await expect(page.getByRole('heading', { name: /Clean and deburr/ })).toBeVisible(); // applied at once all the same

  await page.unroute(saves);
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible({
    timeout: 15_000,
  });
  const { events } = (await (await page.request.get(`/api/wheels/${wheelId}/events`)).json())
    .data as { events: { type: string; payload: { step?: string } }[] };
  expect(events.map((e) => `${e.type}:${e.payload.step}`)).toEqual(['step_done:safety']);
});

test('a wrench not verified today is checked on the spot: out of tolerance takes it out, the next suitable one is offered', async ({
  page,
}) => {
  const RED = { ...BLUE, label: 'Red click 10–150 in-lb', min: 10, max: 150 };
  const { job, wheelId } = await setUpWheel(page, { wrenches: [BLUE, RED], unverified: true });
  await page.goto(`/jobs/${job.id}/wheels/${wheelId}/run`);
  // Safety gate, clean, inspect, mount, index: ticked and done, one screen after another.
  for (let n = 1; n <= 5; n++) {
    await expect(page.getByRole('heading', { name: new RegExp(`^Step ${n} of`) })).toBeVisible();
    for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
    await page.getByRole('button', { name: 'Step done' }).click();
  }
  await startAllBolts(page);

  // 43 in-lb sits higher on the red wrench's scale, so the engine suggests it; it has no check today.
  const check = page.getByRole('region', { name: 'Verify the wrench' });
  await expect(check).toContainText(
    'Check Red click 10–150 in-lb on the tester before this pass. No passing verification today.',
  );
  await expect(page.getByRole('button', { name: /^Clicked/ })).toHaveCount(0);
  // The reference proposed is the pass's own setting.
  await expect(check.getByLabel('Reference (in-lb)')).toHaveValue('43');
  await check.getByLabel('Reference (in-lb)').fill('100');
  await check.getByLabel('Reading (in-lb)').fill('93');
  await check.getByRole('button', { name: 'Record verification' }).click();
  await expect(
    page.getByRole('alert').filter({ hasText: 'Out of tolerance (-7.0 %, allowed ±4 %)' }),
  ).toBeVisible();

  // The red wrench is out; the blue one is next, and it too is checked before its first pass.
  await expect(check).toContainText(
    'Check Blue click 20–200 in-lb on the tester before this pass.',
  );
  await check.getByLabel('Reference (in-lb)').fill('43');
  await check.getByLabel('Reading (in-lb)').fill('44');
  await check.getByRole('button', { name: 'Record verification' }).click();
  await expect(page.getByText('Set Blue click 20–200 in-lb to 43 in-lb')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Clicked — bolt 1' })).toHaveCount(0); // not before the wrench is set
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await expect(page.getByRole('button', { name: 'Clicked — bolt 1' })).toBeVisible();

  await page.goto('/tool-crib');
  await expect(page.getByRole('row', { name: /Red click 10–150 in-lb/ })).toContainText(
    /out of service/i,
  );
});
