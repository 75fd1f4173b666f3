import { expect, test, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { expectNoSideScroll, signUp, uniqueEmail } from './helpers';
import { confirmBolts, startAllBolts, tapConfirmation } from './runner-helpers';

const SHOTS = path.join(process.cwd(), '.data', 'screenshots');
mkdirSync(SHOTS, { recursive: true });

test.use({ viewport: { width: 360, height: 640 } });

async function api<T>(page: Page, method: 'GET' | 'POST', url: string, body?: unknown): Promise<T> {
  const origin = new URL(page.url()).origin;
  const res = await page.request.fetch(url, {
    method,
    data: body,
    headers: { origin, 'content-type': 'application/json' },
  });
  expect(res.ok(), `${method} ${url}: ${await res.text()}`).toBe(true);
  return ((await res.json()) as { data: T }).data;
}

type WrenchBody = {
  label: string;
  kind: 'click' | 'beam' | 'dial' | 'digital';
  min: number;
  max: number;
  unit: 'lbf-in';
  graduation: number;
  checkedAt: number[];
};

// Two click wrenches: 43 in-lb (pass 1 of a 12 ft-lb ring) fits only the small one, 101 and 144
// in-lb only the large one, so the wrench changes between pass 1 and pass 2.
const SMALL: WrenchBody = {
  label: 'Small click 10–60 in-lb',
  kind: 'click',
  min: 10,
  max: 60,
  unit: 'lbf-in',
  graduation: 1,
  checkedAt: [43],
};
const LARGE: WrenchBody = {
  label: 'Large click 50–250 in-lb',
  kind: 'click',
  min: 50,
  max: 250,
  unit: 'lbf-in',
  graduation: 1,
  checkedAt: [101, 144],
};

/** A lead's shop with wrenches verified today at their working points, a spec and a one-wheel job assigned to the lead. */
async function setUpWheel(
  page: Page,
  {
    boltCount = 8,
    wrenches = [SMALL, LARGE],
  }: { boltCount?: number; wrenches?: WrenchBody[] } = {},
) {
  await signUp(page, 'Procedure Rim Shop', 'Rae Ring', uniqueEmail('procedure'));
  const me = (await api<{ id: string }[]>(page, 'GET', '/api/team/members'))[0]!;
  const calibrationDueOn = new Date(Date.now() + 200 * 86_400_000).toISOString().slice(0, 10);
  for (const { checkedAt, ...body } of wrenches) {
    const wrench = await api<{ id: string }>(page, 'POST', '/api/wrenches', {
      ...body,
      calibrationDueOn,
    });
    for (const referenceValue of checkedAt)
      await api(page, 'POST', `/api/wrenches/${wrench.id}/verifications`, {
        referenceValue,
        readingValue: referenceValue,
        unit: 'lbf-in',
      });
  }
  const spec = await api<{ id: string }>(page, 'POST', '/api/specs', {
    name: `${boltCount}-bolt procedure ring`,
    boltCount,
    boltThread: 'M8×1.25',
    finalTorque: 12,
    torqueUnit: 'lbf-ft',
    passPercents: [30, 70, 100],
    patternKind: 'cross',
    checkPass: true,
    maxBeadSeatPressure: 30,
    runningPressure: 14,
    pressureUnit: 'psi',
  });
  const job = await api<{ id: string; wheels: { id: string }[] }>(page, 'POST', '/api/jobs', {
    customer: { name: 'Ada Offroad', phone: '', email: '' },
    vehicle: { make: 'Boreal', model: 'Scout', description: '' },
    wheels: [
      {
        position: 'LF',
        specId: spec.id,
        tireSize: '26x9-14',
        directional: false,
        targetPressure: 8,
        pressureUnit: 'psi',
      },
    ],
    dismount: false,
    reinstall: false,
    assigneeId: me.id,
  });
  return { job, wheelId: job.wheels[0]!.id };
}

/** Safety, clean, inspect, mount, index: every box ticked, "Step done". */
async function toHandStart(page: Page, jobId: string, wheelId: string) {
  await page.goto(`/jobs/${jobId}/wheels/${wheelId}/run`);
  for (let n = 1; n <= 5; n++) {
    await expect(page.getByRole('heading', { name: new RegExp(`^Step ${n} of`) })).toBeVisible();
    for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
    await page.getByRole('button', { name: 'Step done' }).click();
  }
  await expect(page.getByRole('heading', { name: /Start every bolt by hand/ })).toBeVisible();
}

/** The current setting and the big button are both on the screen, whatever the scroll. */
async function expectSettingBesideButton(page: Page, setting: string) {
  const strip = page.getByLabel('Current setting');
  const button = page
    .getByRole('button', { name: /^(Clicked|Reached) — bolt \d+$|^Didn't turn$/ })
    .first();
  for (const scroll of ['top', 'bottom'] as const) {
    await page.evaluate(
      (to) => window.scrollTo(0, to === 'top' ? 0 : document.body.scrollHeight),
      scroll,
    );
    await expect(strip).toContainText(setting);
    await expect(strip, `setting in view (${scroll})`).toBeInViewport({ ratio: 1 });
    await expect(button, `button in view (${scroll})`).toBeInViewport({ ratio: 1 });
  }
}

test('passes that change wrench: the setting card at every pass gates the first bolt, and the setting stays beside the button', async ({
  page,
}) => {
  test.setTimeout(150_000);
  const { job, wheelId } = await setUpWheel(page);
  await toHandStart(page, job.id, wheelId);
  await expect(page.getByText('Press the ring down to start the next bolt.')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Bolt 1 started by hand' })).toBeVisible();
  await page.getByRole('button', { name: 'Bolt 1 started by hand' }).click();
  // Across the ring, not round it: the cross order's second bolt is opposite the first.
  await expect(page.getByRole('button', { name: 'Bolt 5 started by hand' })).toBeVisible();
  await startAllBolts(page);

  const card = page.getByRole('region', { name: 'Wrench setting' });
  const passes = [
    { name: 'Pass 1 of 3', setting: 'Set Small click 10–60 in-lb to 43 in-lb' },
    { name: 'Pass 2 of 3', setting: 'Set Large click 50–250 in-lb to 101 in-lb' },
    { name: 'Pass 3 of 3', setting: 'Set Large click 50–250 in-lb to 144 in-lb' },
    { name: 'Check pass', setting: 'Set Large click 50–250 in-lb to 144 in-lb' },
  ];
  for (const [i, pass] of passes.entries()) {
    await expect(card).toContainText(pass.name);
    await expect(card).toContainText(pass.setting);
    await expect(
      page.getByRole('button', { name: /^Clicked — bolt \d+$|^Didn't turn$/ }),
    ).toHaveCount(0);
    await expectNoSideScroll(page);
    if (i === 1) await page.screenshot({ path: path.join(SHOTS, 'setting-card-360x640.png') });
    await page.getByRole('button', { name: 'Wrench set' }).click();
    await expectSettingBesideButton(page, pass.setting.replace(/^Set /, ''));
    await confirmBolts(page, 8);
  }
  await expect(page.getByRole('button', { name: 'Torque passes done' })).toBeVisible();
});

test('a bolt flagged as stripped stops the wheel, is marked on the circle, and the lead sees the flagged wheel on the job card', async ({
  page,
}) => {
  const { job, wheelId } = await setUpWheel(page);
  await toHandStart(page, job.id, wheelId);
  await startAllBolts(page);
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await confirmBolts(page, 2); // bolts 1 and 5 of the cross order
  await page.getByRole('button', { name: 'Problem with this bolt' }).click();
  await expect(page.getByText('Problem with bolt 3')).toBeVisible();
  await page.getByRole('radio', { name: 'Stripped thread' }).check();
  await page.getByLabel('Note (optional)').fill('Thread pulled out of the rim');
  await page.getByRole('button', { name: 'Stop the wheel and flag it' }).click();

  await expect(
    page.getByRole('alert').filter({ hasText: 'Wheel stopped: problem with a bolt' }),
  ).toContainText('Bolt 3 (pass 1): stripped thread — Thread pulled out of the rim');
  await expect(page.getByRole('img', { name: /^bolt 3, .*problem flagged$/ })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();
  await page.screenshot({ path: path.join(SHOTS, 'flagged-bolt-360x640.png'), fullPage: true });

  await page.goto(`/jobs/${job.id}`);
  await expect(page.getByRole('alert').filter({ hasText: 'Stopped for a lead' })).toContainText(
    'Bolt 3 (pass 1): stripped thread',
  );
});

test('a check pass with one bolt that turned adds another check pass; a lap where nothing turns ends the passes', async ({
  page,
}) => {
  test.setTimeout(150_000);
  const { job, wheelId } = await setUpWheel(page);
  await toHandStart(page, job.id, wheelId);
  await startAllBolts(page);
  await confirmBolts(page, 24); // passes 1 to 3
  const card = page.getByRole('region', { name: 'Wrench setting' });
  await expect(card).toContainText('Check pass');
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await expect(page.getByText('Bolt 1: did it turn before the wrench clicked?')).toBeVisible();
  await tapConfirmation(page, page.getByRole('button', { name: 'Turned' }));
  await confirmBolts(page, 7); // "Didn't turn" for the rest
  await expect(card).toContainText('Check pass 2');
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await confirmBolts(page, 8);
  await expect(page.getByRole('button', { name: 'Torque passes done' })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Saved' })).toBeVisible();
  const { events } = await api<{
    events: { type: string; payload: { pass?: number; bolt?: number; turned?: boolean } }[];
  }>(page, 'GET', `/api/wheels/${wheelId}/events`);
  const checks = events.filter((e) => e.type === 'bolt_confirmed' && (e.payload.pass ?? 0) >= 4);
  expect(checks.filter((e) => e.payload.pass === 4)).toHaveLength(8);
  expect(checks.filter((e) => e.payload.pass === 5)).toHaveLength(8);
  expect(
    checks.filter((e) => e.payload.turned).map((e) => `${e.payload.pass}:${e.payload.bolt}`),
  ).toEqual(['4:1']);
});

test('a 32-bolt ring at 360 px: every bolt has a tap target of at least 44 px, turn numbers only for the next few', async ({
  page,
}) => {
  test.setTimeout(150_000);
  const { job, wheelId } = await setUpWheel(page, { boltCount: 32 });
  await toHandStart(page, job.id, wheelId);
  await startAllBolts(page);
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await confirmBolts(page, 3);
  await expectNoSideScroll(page);
  await page.evaluate(() => window.scrollTo(0, 0));
  await page.screenshot({ path: path.join(SHOTS, 'ring-32-bolts-360x640.png') });
  // The circle is a picture at this size; the list takes the taps, a quarter at a time.
  await expect(
    page.getByRole('group', { name: /^Bolt circle, pass 1/ }).getByRole('button'),
  ).toHaveCount(0);
  await page.getByText('Tap a bolt (list, by quarter)').click();
  const quarters = page.getByRole('group', { name: 'Quarter of the ring' }).getByRole('button');
  await expect(quarters).toHaveCount(4);
  for (let q = 0; q < 4; q++) {
    await quarters.nth(q).click();
    const bolts = page.getByRole('button', { name: /^bolt \d+/ });
    await expect(bolts).toHaveCount(8);
    for (const b of await bolts.all()) {
      const box = (await b.boundingBox())!;
      expect(
        Math.min(box.width, box.height),
        (await b.getAttribute('aria-label')) ?? '',
      ).toBeGreaterThanOrEqual(44);
    }
  }
  // Turn numbers drawn: the next few only (4), never all 32; each bolt keeps its number beside
  // the ring (the turn numbers sit on a layer of their own, outside the bolt buttons).
  const ring = page.getByRole('group', { name: /^Bolt circle, pass 1/ });
  expect(await ring.locator('g[data-state] > text').count()).toBe(32);
  expect(await ring.locator('text[data-turn]').count()).toBe(4);
});
