import { expect, test, type Page } from '@playwright/test';
import { expectNoSideScroll, signUp, uniqueEmail } from './helpers';

/** A same-origin API call with the page's session, as the app itself would make it. */
async function api<T>(page: Page, path: string, body: unknown): Promise<T> {
  const origin = new URL(page.url()).origin;
  const res = await page.request.fetch(path, {
    method: 'POST',
    data: body,
    headers: { origin, 'content-type': 'application/json' },
  });
  expect(res.ok(), `POST ${path}: ${await res.text()}`).toBe(true);
  return ((await res.json()) as { data: T }).data;
}

/** A one-wrench shop: a 5–80 ft-lb click wrench and a 10 ft-lb ring (passes at 3, 7 and 10 ft-lb). */
async function oneWrenchShop(page: Page) {
  await signUp(page, 'One Wrench Rings', 'Rae Lead', uniqueEmail('settings'));
  const calibrationDueOn = new Date(Date.now() + 200 * 86_400_000).toISOString().slice(0, 10);
  await api(page, '/api/wrenches', {
    label: 'Grey click 5–80 ft-lb',
    kind: 'click',
    min: 5,
    max: 80,
    unit: 'lbf-ft',
    graduation: 1,
    calibrationDueOn,
  });
  return api<{ id: string }>(page, '/api/specs', {
    name: '10 ft-lb sport ring',
    boltCount: 16,
    boltThread: 'M8×1.25',
    finalTorque: 10,
    torqueUnit: 'lbf-ft',
    passPercents: [30, 70, 100],
    patternKind: 'cross',
    checkPass: true,
    maxBeadSeatPressure: 30,
    runningPressure: 14,
    pressureUnit: 'psi',
  });
}

async function lowerTheFloorToZero(page: Page, specId: string) {
  await page.goto(`/specs/${specId}`);
  const preview = page.getByRole('region', { name: 'Plan preview' });
  // 10 ft-lb is 12.5 % of the wrench's 80: under the new shop's 20 % floor, so no wrench is offered.
  await expect(preview.getByRole('row', { name: /Pass 3 \(100 %\)/ })).toContainText(
    "No wrench suits 10 ft-lb. Grey click 5–80 ft-lb: 10 ft-lb is below the shop's floor of 20 % of its maximum (16 ft-lb)",
  );

  await page
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: 'Settings' })
    .click();
  await expect(page.getByRole('heading', { name: 'Shop settings' })).toBeVisible();
  const floor = page.getByLabel('Wrench floor (% of maximum)');
  await expect(floor).toHaveValue('20');
  await expect(floor).toHaveAccessibleDescription(/0 lets only the wrench's lowest mark limit it/);

  // A floor of 100 % would leave no wrench for anything: refused at the field, nothing saved.
  await floor.fill('100');
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(floor).toHaveAccessibleDescription(/must be from 0 to below 100 %/);
  await page.reload();
  await expect(page.getByLabel('Wrench floor (% of maximum)')).toHaveValue('20');

  await page.getByLabel('Wrench floor (% of maximum)').fill('0');
  await page.getByRole('button', { name: 'Save settings' }).click();
  await expect(page.getByRole('status')).toContainText('Settings saved.');
  await expect(page.getByLabel('Wrench floor (% of maximum)')).toHaveValue('0');

  await page.goto(`/specs/${specId}`);
  // Now only the wrench's lowest mark (5 ft-lb) limits it: passes 2 and 3 get it, pass 1 (3 ft-lb) still cannot.
  await expect(preview.getByRole('row', { name: /Pass 2 \(70 %\)/ })).toContainText(
    'Grey click 5–80 ft-lb set to 7 ft-lb',
  );
  await expect(preview.getByRole('row', { name: /Pass 3 \(100 %\)/ })).toContainText(
    'Grey click 5–80 ft-lb set to 10 ft-lb',
  );
  await expect(preview.getByRole('row', { name: /Pass 1 \(30 %\)/ })).toContainText(
    'below its lowest mark 5 ft-lb',
  );
}

test('desktop: a lead lowers the wrench floor to 0 on the Settings page and the spec preview offers the wrench', async ({
  page,
}) => {
  test.setTimeout(120_000);
  const spec = await oneWrenchShop(page);
  await lowerTheFloorToZero(page, spec.id);
});

test.describe('at 360×640', () => {
  test.use({ viewport: { width: 360, height: 640 }, isMobile: true, hasTouch: true });

  test('the Settings page fits a phone and the floor change reaches the spec preview', async ({
    page,
  }) => {
    test.setTimeout(120_000);
    const spec = await oneWrenchShop(page);
    await lowerTheFloorToZero(page, spec.id);
    await page.goto('/settings');
    await expectNoSideScroll(page, 'the Settings page');
    // Every rule is explained on the page, in a sentence under its field.
    for (const label of [
      'Time zone',
      'Wrench floor (% of maximum)',
      'Verification must be from',
      'Verified near the setting (± %)',
      'Too fast (seconds per bolt)',
      'Re-check after the first ride (days)',
      'Pressure unit',
      'Torque unit',
      'A single lead may sign off their own work',
    ]) {
      await expect(page.getByLabel(label), label).toHaveAccessibleDescription(/\w{4,}.*\w{4,}/);
    }
  });
});
