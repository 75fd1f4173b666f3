import { expect, type Page } from '@playwright/test';

let counter = 0;
export const uniqueEmail = (who: string) => `${who}-${Date.now().toString(36)}-${counter++}@e2e.test`;
export const PASSWORD = 'gloves-on-and-torqued';

export async function signUp(page: Page, shopName: string, name: string, email: string) {
  await page.goto('/sign-up');
  await page.getByLabel('Shop name').fill(shopName);
  await page.getByLabel('Your name').fill(name);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Create shop and sign in' }).click();
  await expect(page.getByRole('heading', { name: 'Board' })).toBeVisible();
}

export async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function invite(page: Page, email: string, role: 'Lead' | 'Technician' | 'Apprentice') {
  await page.goto('/team');
  const form = page.getByRole('form', { name: 'Invite a team member' });
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Role').selectOption({ label: role });
  await form.getByRole('button', { name: 'Send invite' }).click();
  await expect(page.getByRole('status')).toHaveText(`Invite sent to ${email}.`);
}
