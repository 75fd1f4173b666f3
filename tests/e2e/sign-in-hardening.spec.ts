import { expect, test } from '@playwright/test';
import { PASSWORD, signIn, signUp, uniqueEmail } from './helpers';
import { authFile } from './roles';

test.describe('as the shared lead', () => {
  test.use({ storageState: authFile('lead') });

  test('signed in, /sign-in?next=/.//evil.test/x stays on this site', async ({ page }) => {
    const response = await page.request.get('/sign-in?next=/.//evil.test/x', { maxRedirects: 0 });
    expect(response.status()).toBe(307);
    expect(response.headers()['location']).toBe('/board');
  });
});

test('a made-up X-Forwarded-For does not give a sign-in guesser a fresh address', async ({
  page,
}) => {
  const lead = uniqueEmail('spoof');
  await signUp(page, 'Spoofproof Rims', 'Sol Proof', lead);
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  for (let i = 1; i <= 5; i++) {
    await page.setExtraHTTPHeaders({ 'x-forwarded-for': `203.0.113.${i}` });
    await signIn(page, lead, `not-it-${i}`);
    await expect(page.getByRole('alert').filter({ hasText: /./ })).toHaveText(
      'Wrong e-mail or password.',
    );
  }
  // The server counts the socket's address (no proxy is trusted by default), so a sixth
  // "address" is the same one, and its limit holds even for the right password.
  await page.setExtraHTTPHeaders({ 'x-forwarded-for': '203.0.113.99' });
  await signIn(page, lead, PASSWORD);
  await expect(page.getByRole('alert').filter({ hasText: /./ })).toContainText('Try again later');
});
