import { expect, test, type Page } from '@playwright/test';
import { expectNoSideScroll } from './helpers';
import { authFile } from './roles';

// 35 bar is 507.6 psi (1 bar = 100 kPa, 1 psi = 6.894 757 kPa: NIST SP 811 App. B); the ceiling
// is the tire industry's 40 psi bead-seating guidance for passenger and light-truck tires.
const REFUSED = /35 bar is 507\.6 psi: above the 40 psi bead-seating ceiling/;

// The shared shop's lead; each test names its spec apart, since both land in the same spec list.
test.use({ storageState: authFile('lead') });

async function refusedInBar(page: Page, name: string) {
  await page.goto('/specs/new');
  await page.getByLabel('Spec name').fill(name);
  await page.getByLabel('Bolt count').fill('16');
  await page.getByLabel('Ring bolt thread').fill('M8×1.25');
  await page.getByLabel('Final torque').fill('15');
  await page.getByLabel('Pressure unit').selectOption({ label: 'bar' });

  // As they type: refused at the field, in words that name psi.
  const seat = page.getByLabel('Maximum bead-seating pressure');
  await seat.pressSequentially('35');
  await expect(seat).toHaveAttribute('aria-invalid', 'true');
  await expect(seat).toHaveAccessibleDescription(REFUSED);
  await page.getByLabel('Running pressure').fill('1.2');

  // On save: the server refuses it too, and nothing is created.
  await page.getByRole('button', { name: 'Create spec' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'nothing was saved' })).toContainText(
    REFUSED,
  );
  await expect(page.getByRole('heading', { name: 'New wheel spec' })).toBeVisible();
  await expect(seat).toHaveAccessibleDescription(REFUSED);

  // Corrected to the tire maker's 2.4 bar (34.8 psi), it saves.
  await seat.fill('2.4');
  await expect(seat).not.toHaveAttribute('aria-invalid');
  await page.getByRole('button', { name: 'Create spec' }).click();
  await expect(page.getByRole('heading', { name })).toBeVisible();
  await page.goto('/specs');
  await expect(page.getByRole('link', { name })).not.toContainText('Flagged');
}

test('a lead types a bead-seat limit in bar and sees it refused, naming psi, as they type and on save (desktop)', async ({
  page,
}) => {
  await refusedInBar(page, 'Kestrel 16 in sport (desktop)');
});

test.describe('on a phone (360×640)', () => {
  test.use({
    viewport: { width: 360, height: 640 },
    isMobile: true,
    hasTouch: true,
    deviceScaleFactor: 2.75,
  });

  test('the same refusal, and the form fits the screen', async ({ page }) => {
    await refusedInBar(page, 'Kestrel 16 in sport (phone)');
    await page.goto('/specs/new');
    await expectNoSideScroll(page, 'the spec form');
  });
});
