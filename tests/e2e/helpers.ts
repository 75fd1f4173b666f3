import { expect, type Browser, type Page } from '@playwright/test';
import { waitForMail } from '@/tests/helpers/mailbox';
import { E2E } from '@/tests/helpers/test-services';

let counter = 0;
// The process id keeps two workers that ask in the same millisecond apart.
export const uniqueEmail = (who: string) =>
  `${who}-${Date.now().toString(36)}-${process.pid.toString(36)}-${counter++}@e2e.test`;
export const PASSWORD = 'gloves-on-and-torqued';

export async function signUp(page: Page, shopName: string, name: string, email: string) {
  await page.goto('/sign-up');
  await page.getByLabel('Shop name').fill(shopName);
  await page.getByLabel('Your name').fill(name);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Create shop' }).click();
  await expect(page.getByRole('status')).toContainText(
    `Check your e-mail at ${email.toLowerCase()}`,
  );
  // The link that finishes sign-up goes to the address alone (it belongs to no shop's Mailbox).
  const mail = await waitForMail(E2E.sink.dir, email.toLowerCase());
  const link = /https?:\/\/\S+\/sign-up\/[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
  await page.goto(new URL(link!).pathname);
  await page.getByRole('button', { name: `Create ${shopName} and sign in` }).click();
  await expect(page.getByRole('heading', { name: 'Board' })).toBeVisible();
}

export async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function invite(
  page: Page,
  email: string,
  role: 'Lead' | 'Technician' | 'Apprentice',
) {
  await page.goto('/team');
  const form = page.getByRole('form', { name: 'Invite a team member' });
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Role').selectOption({ label: role });
  await form.getByRole('button', { name: 'Send invite' }).click();
  await expect(page.getByRole('status')).toHaveText(`Invite sent to ${email}.`);
}

/** Mail goes out from the queue's worker a moment after the action: wait until the sink has it. */
export const mailArrived = (to: string) => waitForMail(E2E.sink.dir, to.toLowerCase(), 15_000);

/** Invites someone, follows the link from the Mailbox in a fresh browser and joins as `name`. */
export async function inviteAndJoin(
  page: Page,
  browser: Browser,
  email: string,
  name: string,
  role: 'Lead' | 'Technician' | 'Apprentice',
) {
  await invite(page, email, role);
  await mailArrived(email);
  await page.goto('/mailbox');
  const link = await page
    .getByRole('article', { name: new RegExp(`to ${email.replace(/[.+]/g, '\\$&')}`) })
    .getByRole('link')
    .getAttribute('href');
  const context = await browser.newContext();
  const joined = await context.newPage();
  await joined.goto(link!);
  await joined.getByLabel('Your name').fill(name);
  await joined.getByLabel('Choose a password').fill(PASSWORD);
  await joined.getByRole('button', { name: 'Join the shop' }).click();
  // A technician starts at their wheels, an apprentice at practice, a lead at the board.
  const home = { Technician: 'My wheels', Apprentice: 'Practice', Lead: 'Board' }[role];
  await expect(joined.getByRole('heading', { name: home, exact: true })).toBeVisible();
  return { context, page: joined };
}

/** A phone screen never scrolls sideways: a technician with gloves on cannot chase a clipped control. */
export async function expectNoSideScroll(page: Page, where = 'the page') {
  // Against the emulated viewport, not innerWidth: a phone widens its layout viewport to fit what overflows.
  const scroll = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(scroll, `${where} is wider than the screen`).toBeLessThanOrEqual(
    page.viewportSize()!.width,
  );
}
