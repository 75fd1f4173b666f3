import { expect, test } from '@playwright/test';
import { invite, mailArrived, PASSWORD, signIn, signUp, uniqueEmail } from './helpers';
import { contextAs, sharedPeople } from './roles';

test('a lead signs up, invites a technician by e-mail; the technician accepts, signs in and lands on their (empty) wheels; the board is one tap away', async ({
  page,
  browser,
}) => {
  const lead = uniqueEmail('lead');
  const tech = uniqueEmail('tech');
  await signUp(page, 'Sandwash Tire & Wheel', 'Petra Lug', lead);
  await expect(page.getByText('No job cards yet')).toBeVisible();
  await invite(page, tech, 'Technician');
  await expect(page.getByRole('region', { name: /Pending invites/ }).getByText(tech)).toBeVisible();

  // The invite arrives in the local sink (from the queue); the Mailbox page shows it like an inbox would.
  await mailArrived(tech);
  await page.goto('/mailbox');
  const mail = page.getByRole('article', {
    name: new RegExp(`Petra Lug invited you to Sandwash Tire & Wheel on Ringpass to ${tech}`),
  });
  await expect(mail).toBeVisible();
  const link = await mail.getByRole('link').getAttribute('href');
  expect(link).toMatch(/\/invite\//);

  const techContext = await browser.newContext();
  const techPage = await techContext.newPage();
  await techPage.goto(link!);
  await expect(techPage.getByRole('heading', { name: 'Join Sandwash Tire & Wheel' })).toBeVisible();
  await techPage.getByLabel('Your name').fill('Kai Bead');
  await techPage.getByLabel('Choose a password').fill(PASSWORD);
  await techPage.getByRole('button', { name: 'Join the shop' }).click();
  await expect(techPage.getByRole('heading', { name: 'My wheels' })).toBeVisible();
  await expect(techPage.getByText('Signed in as Kai Bead (Technician)')).toBeVisible();

  // Sign out ends the session; signing in again lands on My wheels, still empty.
  await techPage.getByRole('button', { name: 'Sign out' }).click();
  await expect(techPage.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await techPage.goto('/board');
  await expect(techPage.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await signIn(techPage, tech);
  await expect(techPage.getByRole('heading', { name: 'My wheels' })).toBeVisible();
  await expect(techPage.getByText('No wheels waiting for you')).toBeVisible();
  await techPage
    .getByRole('navigation', { name: 'Main' })
    .getByRole('link', { name: 'Board' })
    .click();
  await expect(techPage.getByRole('heading', { name: 'Board' })).toBeVisible();
  // A technician's board shows their own work by default; nothing is assigned yet.
  await expect(techPage.getByText('No job cards assigned to you yet')).toBeVisible();
  // A technician sees no Team link and cannot open the lead-only page.
  await expect(
    techPage.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Team' }),
  ).toHaveCount(0);
  const response = await techPage.goto('/team');
  expect(response?.status()).toBe(403);
  await expect(techPage.getByRole('heading', { name: 'Not for your role' })).toBeVisible();

  // The invite link worked once.
  await techPage.goto(link!);
  await expect(techPage.getByRole('heading', { name: 'Invite not usable' })).toBeVisible();
  await techContext.close();
});

test('a wrong password gets a clear error; the sixth wrong password in a row is refused with "try again later"', async ({
  page,
}) => {
  const lead = uniqueEmail('locked');
  await signUp(page, 'Rockcrawl Rims', 'Omar Seat', lead);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible(); // the session is gone before we go on
  for (let i = 1; i <= 5; i++) {
    await signIn(page, lead, `not-the-password-${i}`);
    await expect(page.getByRole('alert').filter({ hasText: /./ })).toHaveText(
      'Wrong e-mail or password.',
    );
    await expect(page.getByLabel('E-mail')).toHaveValue(lead);
  }
  await signIn(page, lead, 'not-the-password-6');
  await expect(page.getByRole('alert').filter({ hasText: /./ })).toContainText(
    'Too many failed sign-ins. Try again later',
  );
  await signIn(page, lead, PASSWORD);
  await expect(page.getByRole('alert').filter({ hasText: /./ })).toContainText('Try again later');
});

test('bad input on sign-up gets a message at each field and creates nothing', async ({ page }) => {
  await page.goto('/sign-up');
  await page.getByLabel('E-mail').fill('not-an-address');
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create shop' }).click();
  await expect(page.getByText('Enter the shop name (at least 2 characters).')).toBeVisible();
  await expect(
    page.getByText('Enter a valid e-mail address, like name@example.com.'),
  ).toBeVisible();
  await expect(page.getByText('Use at least 12 characters.')).toBeVisible();
  await expect(page.getByLabel('E-mail')).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByLabel('E-mail')).toHaveValue('not-an-address');
});

test("a user of one shop gets 404 for another shop's id", async ({ browser }) => {
  // The shared shop's lead and the second shop's lead, both signed in by the setup project.
  const lead = sharedPeople().lead;
  const shopA = await contextAs(browser, 'lead');
  const page = shopA.page;
  await page.goto('/team');
  await page.getByRole('link', { name: lead.name }).click();
  await expect(page.getByRole('heading', { name: lead.name })).toBeVisible();
  const memberUrl = page.url();
  await shopA.context.close();

  const { context: other, page: pageB } = await contextAs(browser, 'other-lead');
  const response = await pageB.goto(memberUrl);
  expect(response?.status()).toBe(404);
  await expect(pageB.getByRole('heading', { name: 'Not found' })).toBeVisible();
  const api = await pageB.request.get(memberUrl.replace('/team/', '/api/team/members/'));
  expect(api.status()).toBe(404);
  expect(await api.json()).toEqual({
    error: { code: 'not_found', message: 'That team member was not found.' },
  });
  await other.close();
});
