import { expect, test, type Page } from '@playwright/test';
import postgres from 'postgres';
import { clusterUrl } from '@/db/cluster';
import { E2E } from '../helpers/test-services';
import { inviteAndJoin, signIn, signUp, uniqueEmail } from './helpers';

/** A same-origin API call with the page's session, as the app itself would make it. */
async function api<T>(
  page: Page,
  method: 'GET' | 'POST',
  path: string,
  body?: unknown,
): Promise<T> {
  const origin = new URL(page.url()).origin;
  const res = await page.request.fetch(path, {
    method,
    data: body,
    headers: { origin, 'content-type': 'application/json' },
  });
  expect(res.ok(), `${method} ${path}: ${await res.text()}`).toBe(true);
  return ((await res.json()) as { data: T }).data;
}

type Job = { id: string; number: number; wheels: { id: string; position: string }[] };
const inHours = (h: number) => new Date(Date.now() + h * 3_600_000).toISOString();

test('a technician signs in on a phone and lands on My wheels: the sent-back wheel first, one tap opens its runner; the board and the list arrive in the first HTML', async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  await signUp(page, 'Next Wheel Tires', 'Lou Lead', uniqueEmail('lead'));
  const techEmail = uniqueEmail('tech');
  const tech = await inviteAndJoin(page, browser, techEmail, 'Tia Tread', 'Technician');
  await expect(tech.page.getByText('No wheels waiting for you')).toBeVisible();
  const techId = (await api<{ id: string; name: string }[]>(page, 'GET', '/api/team/members')).find(
    (m) => m.name === 'Tia Tread',
  )!.id;

  const spec = await api<{ id: string }>(page, 'POST', '/api/specs', {
    name: '8-bolt home ring',
    boltCount: 8,
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
  const wheel = (position: string) => ({
    position,
    specId: spec.id,
    tireSize: '26x9-14',
    directional: false,
    targetPressure: 8,
    pressureUnit: 'psi',
  });
  const newJob = (customer: string, positions: string[], dueAt: string) =>
    api<Job>(page, 'POST', '/api/jobs', {
      customer: { name: customer, phone: '', email: '' },
      vehicle: { make: 'Boreal', model: 'Scout', description: '' },
      wheels: positions.map(wheel),
      dismount: false,
      reinstall: false,
      assigneeId: techId,
      dueAt,
    });
  const soon = await newJob('Sam Soon', ['LF', 'RF'], inHours(2));
  const later = await newJob('Lee Later', ['LF'], inHours(30));

  // The later job's wheel comes back from the lead (set straight in the database: the send-back
  // itself is proven in review.spec). Sent back outranks a sooner due time.
  const sql = postgres(clusterUrl(E2E.database), { max: 1 });
  try {
    await sql`update job_wheels set rework = ${sql.json({ note: 'Bead not seated at the valve', steps: [], byId: techId, at: new Date().toISOString() })} where id = ${later.wheels[0]!.id}`;
    await sql`update jobs set state = 'sent_back' where id = ${later.id}`;
  } finally {
    await sql.end();
  }

  // Signed out and back in, the technician lands on My wheels.
  await tech.page.getByRole('button', { name: 'Sign out' }).click();
  // The session is gone once the sign-in page shows; going there sooner can cut the sign-out short.
  await expect(tech.page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await signIn(tech.page, techEmail);
  await expect(tech.page).toHaveURL(/\/my-wheels$/);
  await expect(tech.page.getByRole('heading', { name: 'My wheels' })).toBeVisible();
  const wheels = tech.page
    .getByRole('list', { name: 'Wheels to do, next first' })
    .getByRole('link');
  await expect(wheels).toHaveCount(3);
  await expect(wheels.nth(0)).toContainText(`Job #${later.number} · Left front`);
  await expect(wheels.nth(0)).toContainText('Sent back');
  await expect(wheels.nth(0)).toContainText('Bead not seated at the valve');
  await expect(wheels.nth(0)).toContainText('Lee Later · Boreal Scout');
  await expect(wheels.nth(0)).toContainText('Tire 26x9-14 · Spec 8-bolt home ring');
  await expect(wheels.nth(1)).toContainText(`Job #${soon.number} · Left front`);
  await expect(wheels.nth(2)).toContainText(`Job #${soon.number} · Right front`);
  await expect(wheels.nth(1)).toContainText(/Due \w{3} \d+, \d{4}, \d+:\d{2} [AP]M/);
  // Big enough for a gloved thumb.
  expect((await wheels.nth(0).boundingBox())!.height).toBeGreaterThanOrEqual(48);
  const scroll = await tech.page.evaluate(() => document.documentElement.scrollWidth);
  expect(scroll).toBeLessThanOrEqual(360);

  // The runner links are in the page's first HTML, before any script runs.
  const html = (await (await tech.page.request.get('/my-wheels')).text()).replaceAll(
    '<!-- -->',
    '',
  );
  expect(html).toContain(`/jobs/${later.id}/wheels/${later.wheels[0]!.id}/run`);

  // One tap opens the sent-back wheel's runner, the lead's note on top.
  await wheels.nth(0).click();
  await expect(tech.page).toHaveURL(`/jobs/${later.id}/wheels/${later.wheels[0]!.id}/run`);
  await expect(tech.page.getByRole('alert', { name: 'Sent back by the lead' })).toContainText(
    'Bead not seated at the valve',
  );

  // The board's first HTML already holds the first page of cards (no script needed to see them),
  // and on a phone its filters wait behind one Filter button.
  // React marks text boundaries with empty comments ("#<!-- -->1001"); a reader sees none.
  const board = (await (await page.request.get('/board')).text()).replaceAll('<!-- -->', '');
  expect(board).toContain(`#${soon.number}`);
  expect(board).toContain('Sam Soon');
  await page.goto('/board');
  const filter = page.getByRole('button', { name: /^Filter/ });
  await expect(filter).toHaveAttribute('aria-expanded', 'false');
  await expect(page.getByRole('search', { name: 'Filter the board' })).toBeHidden();
  await filter.click();
  await expect(filter).toHaveAttribute('aria-expanded', 'true');
  await expect(
    page.getByRole('search', { name: 'Filter the board' }).getByLabel('State'),
  ).toBeVisible();
  await tech.context.close();
});
