import { expect, test, type Page } from '@playwright/test';
import { signUp, uniqueEmail } from './helpers';

// The phone is in Tokyo: nothing on screen may follow the browser's zone, only the shop's.
test.use({ timezoneId: 'Asia/Tokyo' });

async function setShopZone(page: Page, zone: string) {
  await page.goto('/settings');
  await page.getByLabel('Time zone').fill(zone);
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByRole('status')).toContainText('Settings saved.');
}

/** What a `<time>` on screen should read for its instant in the zone (the app's format: en-US, medium date, short time). */
const shopText = (iso: string, timeZone: string) =>
  new Intl.DateTimeFormat('en-US', { timeZone, dateStyle: 'medium', timeStyle: 'short' })
    .format(new Date(iso))
    .replace(/[\u202f\u00a0]/g, ' ');

test("a lead changes the shop's time zone and the job card's times follow it; no UTC on screen", async ({
  page,
}) => {
  test.setTimeout(120_000);
  // A time rendered on the server must read the same in the browser (React error 418 is a hydration mismatch).
  const mismatches: string[] = [];
  page.on('console', (m) => {
    if (m.type() === 'error' && /418|hydrat/i.test(m.text())) mismatches.push(m.text());
  });
  await signUp(page, 'Midnight Bead Co', 'Ada Clock', uniqueEmail('lead'));
  await setShopZone(page, 'America/Denver');

  await page.goto('/specs/new');
  await page.getByLabel('Spec name').fill('Clock 15 in, 24 bolts');
  await page.getByLabel('Bolt count').fill('24');
  await page.getByLabel('Ring bolt thread').fill('M8×1.25');
  await page.getByLabel('Final torque').fill('12');
  await page.getByLabel('Maximum bead-seating pressure').fill('30');
  await page.getByLabel('Running pressure').fill('14');
  await page.getByRole('button', { name: 'Create spec' }).click();
  await expect(page.getByRole('heading', { name: 'Clock 15 in, 24 bolts' })).toBeVisible();

  // The due time is typed on the shop's clock (Denver), though the browser is in Tokyo.
  await page.goto('/jobs/new');
  await page.getByLabel('Customer name').fill('Noor Vance');
  await page.getByLabel('Year').fill('2023');
  await page.getByLabel('Make').fill('Talonworks');
  await page.getByLabel('Model').fill('Ridgeback');
  await page.getByLabel('Left front (LF)').check();
  await page
    .getByRole('region', { name: 'Left front wheel' })
    .getByLabel('Tire size')
    .fill('30x10R15');
  await expect(page.getByText('Shop time: America/Denver.')).toBeVisible();
  await page.getByLabel('Due').fill('2026-12-24T09:30');
  await page.getByRole('button', { name: 'Create job card' }).click();
  await expect(page.getByRole('heading', { name: /Job #1001/ })).toBeVisible();
  await expect(page.getByText('due Dec 24, 2026, 9:30 AM')).toBeVisible();
  await expect(page.getByLabel('Due')).toHaveValue('2026-12-24T09:30');
  const jobUrl = page.url();

  // The API keeps instants: 09:30 in Denver (MST, UTC−7) is 16:30 UTC.
  const api = await page.request.get('/api/jobs');
  expect(((await api.json()) as { data: { dueAt: string }[] }).data[0]!.dueAt).toBe(
    '2026-12-24T16:30:00.000Z',
  );

  await setShopZone(page, 'Europe/Berlin');
  await page.goto(jobUrl);
  await expect(page.getByText('due Dec 24, 2026, 5:30 PM')).toBeVisible(); // 16:30 UTC is 17:30 CET
  await expect(page.getByLabel('Due')).toHaveValue('2026-12-24T17:30');
  const created = page.getByRole('region', { name: 'History' }).locator('time').first();
  await expect(created).toHaveText(
    shopText((await created.getAttribute('datetime'))!, 'Europe/Berlin'),
  );
  await expect(page.locator('main')).not.toContainText('UTC');

  await page.goto('/board?assignee=all');
  const row = page.getByRole('row', { name: /Noor Vance/ });
  await expect(row).toContainText('Dec 24, 2026, 5:30 PM');
  await expect(page.locator('main')).not.toContainText('UTC');
  expect(mismatches).toEqual([]);
});
