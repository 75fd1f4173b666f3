import { expect, test } from '@playwright/test';
import { inviteAndJoin, signUp, uniqueEmail } from './helpers';

test('a lead sets up a spec, a wrench (one verification passes, one fails), a customer with a vehicle and a four-wheel job; the technician sees it on their board', async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  await signUp(page, 'Canyon Bead Works', 'Iris Torque', uniqueEmail('lead'));
  const tech = await inviteAndJoin(page, browser, uniqueEmail('tech'), 'Sol Ring', 'Technician');

  // Wrench first, so the spec preview can plan with it.
  await page.goto('/tool-crib');
  await expect(page.getByText('No torque wrenches yet')).toBeVisible();
  await page.getByRole('link', { name: 'Add a wrench' }).click();
  await page.getByLabel('Label').fill('Blue click 20–200 in-lb');
  await page.getByLabel('Lowest mark').fill('20');
  await page.getByLabel('Highest mark').fill('200');
  await page.getByLabel('Unit').selectOption({ label: 'in-lb' });
  await page.getByLabel('Calibration due').fill('2030-06-30');
  await page.getByRole('button', { name: 'Add wrench' }).click();
  await expect(page.getByRole('heading', { name: 'Blue click 20–200 in-lb' })).toBeVisible();
  const verify = page.getByRole('form', { name: 'Record a verification' });
  await verify.getByLabel('Reference value').fill('100');
  await verify.getByLabel('Reading').fill('102');
  await verify.getByRole('button', { name: 'Record verification' }).click();
  // The time it was recorded reads on the shop's clock.
  await expect(verify.getByRole('status')).toHaveText(
    /^Within tolerance: \+2\.0 % \(allowed ±4 %\)\. Recorded \d{1,2}:\d{2} [AP]M\.$/,
  );
  await expect(page.getByText('In service', { exact: true })).toBeVisible();

  // A second wrench fails its verification and goes out of service.
  await page.goto('/tool-crib/new');
  await page.getByLabel('Label').fill('Grey click 5–80 ft-lb');
  await page.getByLabel('Lowest mark').fill('5');
  await page.getByLabel('Highest mark').fill('80');
  await page.getByLabel('Calibration due').fill('2030-06-30');
  await page.getByRole('button', { name: 'Add wrench' }).click();
  await expect(page.getByRole('heading', { name: 'Grey click 5–80 ft-lb' })).toBeVisible();
  await verify.getByLabel('Reference value').fill('50');
  await verify.getByLabel('Reading').fill('53');
  await verify.getByRole('button', { name: 'Record verification' }).click();
  await expect(verify.getByRole('alert').filter({ hasText: /./ })).toContainText(
    'Out of tolerance: +6.0 % (allowed ±4 %)',
  );
  await page.reload();
  await expect(page.getByText('Out of service', { exact: true }).first()).toBeVisible();
  await expect(page.getByRole('table', { name: /history/i })).toContainText('OUT OF ±4 %');

  // The spec: the preview plans with the in-service wrench only.
  await page.goto('/specs/new');
  await page.getByLabel('Spec name').fill('Canyon 15 in, 24 bolts');
  await page.getByLabel('Bolt count').fill('24');
  await page.getByLabel('Ring bolt thread').fill('M8×1.25');
  await page.getByLabel('Final torque').fill('12');
  await page.getByLabel('Maximum bead-seating pressure').fill('30');
  await page.getByLabel('Running pressure').fill('14');
  await expect(page.getByRole('row', { name: /Pass 1 \(30 %\)/ })).toContainText(
    'Blue click 20–200 in-lb set to 43 in-lb',
  );
  await page.getByRole('button', { name: 'Create spec' }).click();
  await expect(page.getByRole('heading', { name: 'Canyon 15 in, 24 bolts' })).toBeVisible();

  // Customer with a vehicle.
  await page.goto('/customers');
  const addCustomer = page.getByRole('form', { name: 'Add a customer' });
  await addCustomer.getByLabel('Name').fill('Remy Calder');
  await addCustomer.getByLabel('Phone').fill('555-0123');
  await addCustomer.getByRole('button', { name: 'Add customer' }).click();
  await expect(page.getByRole('heading', { name: 'Remy Calder' })).toBeVisible();
  const addVehicle = page.getByRole('form', { name: 'Add a vehicle' });
  await addVehicle.getByLabel('Year').fill('2022');
  await addVehicle.getByLabel('Make').fill('Talonworks');
  await addVehicle.getByLabel('Model').fill('Ridgeback 1000');
  await addVehicle.getByLabel('VIN (optional)').fill('1M8GDM9AXKP042788');
  await addVehicle.getByRole('button', { name: 'Add vehicle' }).click();
  await expect(addVehicle.getByRole('status')).toHaveText('Vehicle added.');
  await expect(page.getByText('2022 Talonworks Ridgeback 1000')).toBeVisible();

  // A four-wheel job assigned to the technician; the axle check speaks up first.
  await page.goto('/jobs/new');
  await page
    .getByLabel('Customer', { exact: true })
    .selectOption({ label: 'Remy Calder · 555-0123' });
  for (const p of ['Left front (LF)', 'Right front (RF)', 'Left rear (LR)', 'Right rear (RR)'])
    await page.getByLabel(p).check();
  for (const [name, size] of [
    ['Left front', '30x10R15'],
    ['Right front', '32x10R15'],
    ['Left rear', '30x10R15'],
    ['Right rear', '30x10R15'],
  ] as const) {
    await page
      .getByRole('region', { name: `${name} wheel` })
      .getByLabel('Tire size')
      .fill(size);
  }
  await expect(page.getByRole('alert').filter({ hasText: 'Tire check' })).toContainText(
    'Front axle: 30x10R15 and 32x10R15 differ',
  );
  await page
    .getByRole('region', { name: 'Right front wheel' })
    .getByLabel('Tire size')
    .fill('30x10R15');
  await expect(page.getByText('Tire check')).toHaveCount(0);
  await page.getByLabel('Assigned to').selectOption({ label: 'Sol Ring' });
  await page.getByRole('button', { name: 'Create job card' }).click();
  await expect(
    page.getByRole('heading', { name: /Job #1001 · 2022 Talonworks Ridgeback 1000/ }),
  ).toBeVisible();
  await expect(page.getByText('Assigned to Sol Ring')).toBeVisible();

  // The technician's board shows it (their default view is their own work).
  await tech.page.goto('/board');
  const row = tech.page.getByRole('row', { name: /Remy Calder/ });
  await expect(row).toContainText('#1001');
  await expect(row).toContainText('Open');
  await expect(row).toContainText('Sol Ring');
  await expect(tech.page.getByLabel('Assigned to')).toHaveValue('me');
  await tech.context.close();
});
