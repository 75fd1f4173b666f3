import { expect, test, type Page } from '@playwright/test';
import { expectNoSideScroll } from './helpers';
import { authFile, contextAs } from './roles';
import { confirmBolts, startAllBolts } from './runner-helpers';
import { api } from './runner-shop';

// The phone project (360×640) as the shared apprentice; a spec of its own, added by the shared lead.
test.use({ storageState: authFile('apprentice') });

/** Every step up to hand-start: tick what is asked, then "Step done". */
async function stepsUntil(page: Page, heading: RegExp) {
  const target = page.getByRole('heading', { name: heading });
  for (let n = 0; n < 10 && !(await target.isVisible()); n++) {
    await expect(page.getByRole('heading', { name: /^Step \d+ of/ })).toBeVisible();
    for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
    await page.getByRole('button', { name: 'Step done' }).click();
    await expect(target.or(page.getByRole('button', { name: 'Step done' }))).toBeVisible();
  }
  await expect(target).toBeVisible();
}

test('an apprentice runs a guided practice attempt to Finish on a phone and sees the score', async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  const lead = await contextAs(browser, 'lead');
  await lead.page.goto('/specs');
  const name = `Practice smoke ${Date.now().toString(36)}`;
  const spec = await api<{ id: string }>(lead.page, 'POST', '/api/specs', {
    name,
    boltCount: 4,
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
  await lead.context.close();

  // Signed in, an apprentice lands on Practice; the nav has no board to stare at.
  await page.goto('/');
  await expect(page.getByRole('heading', { name: 'Practice', exact: true })).toBeVisible();
  const nav = page.getByRole('navigation', { name: 'Main' });
  await expect(nav.getByRole('link', { name: 'Practice' })).toBeVisible();
  await expect(nav.getByRole('link', { name: 'Board' })).toHaveCount(0);
  await expectNoSideScroll(page, 'the practice home');

  await page.getByLabel('Wheel').selectOption(spec.id);
  await page.getByRole('radio', { name: /Guided/ }).check();
  await page.getByRole('button', { name: 'Start the attempt' }).click();
  await page.waitForURL(/\/practice\/attempts\/[0-9a-f-]+$/);
  await expect(page.getByText('Practice — nothing here touches a real wheel.')).toBeVisible();
  await expectNoSideScroll(page, 'the practice runner');

  await stepsUntil(page, /Start every bolt by hand/);
  await startAllBolts(page);
  await confirmBolts(page);
  await page.getByRole('button', { name: 'Torque passes done' }).click();

  // Photos are optional in practice: the bead step says so and does not wait for them.
  await expect(page.getByRole('heading', { name: /Seat the bead/ })).toBeVisible();
  await expect(page.getByText(/Photos are optional in practice/)).toBeVisible();
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByLabel('Highest pressure used to seat the bead').fill('22');
  await page.getByRole('button', { name: 'Step done' }).click();
  await expect(page.getByRole('heading', { name: /Leak check/ })).toBeVisible();
  for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
  await page.getByLabel('Pressure set').fill('14');
  await page.getByRole('button', { name: 'Step done' }).click();

  await page.getByRole('button', { name: 'Finish' }).click();
  await page.waitForURL(/\/result$/);
  await expect(page.getByRole('heading', { name: /^Score: \d+ out of 100$/ })).toBeVisible();
  await expectNoSideScroll(page, 'the result');

  // The home lists it with its score, linked to the same result.
  await page.goto('/practice');
  await expect(
    page.getByRole('link', { name: /out of 100, see the result/ }).first(),
  ).toBeVisible();
});
