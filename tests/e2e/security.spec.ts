import { expect, test, type Page } from '@playwright/test';
import { invite, mailArrived, signIn, signUp, uniqueEmail } from './helpers';
import { contextAs, sharedPeople } from './roles';

/** Collects what Chromium reports as blocked by the Content-Security-Policy on this page. */
function cspViolations(page: Page) {
  const seen: string[] = [];
  page.on('console', (message) => {
    if (/Content Security Policy/i.test(message.text())) seen.push(message.text());
  });
  return seen;
}

test('pages carry a per-response CSP nonce on every script, refuse framing and sniffing; the app runs under it', async ({
  page,
}) => {
  const violations = cspViolations(page);
  const first = await page.request.get('/sign-in');
  const second = await page.request.get('/sign-in');
  const csp = first.headers()['content-security-policy'] ?? '';
  const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
  expect(nonce, 'a nonce in script-src').toBeTruthy();
  expect(second.headers()['content-security-policy']).not.toContain(nonce!);
  expect(csp).toContain("frame-ancestors 'none'");
  expect(first.headers()['x-content-type-options']).toBe('nosniff');
  expect(first.headers()['referrer-policy']).toBe('strict-origin-when-cross-origin');
  expect(first.headers()['strict-transport-security'], 'no HSTS over plain http').toBeUndefined();
  const html = await first.text();
  const scripts = html.match(/<script\b[^>]*>/g) ?? [];
  expect(scripts.length).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);

  // The whole sign-up → board → team flow hydrates and works with the policy on.
  await signUp(page, 'Policy Check Tires', 'Cora Nonce', uniqueEmail('csp'));
  await invite(page, uniqueEmail('csp-invitee'), 'Technician');
  expect(violations).toEqual([]);
});

test('every HTML answer has its CSP nonce: a page asked with a Next-Action header, a urlencoded post with one, a 404 under a name like a skipped file; an unknown /api/ address answers JSON', async ({
  page,
  baseURL,
}) => {
  const nonceOf = (headers: Record<string, string>) =>
    /'nonce-[^']+'/.test(headers['content-security-policy'] ?? '');
  const html = (headers: Record<string, string>) =>
    (headers['content-type'] ?? '').startsWith('text/html');

  const withAction = await page.request.get('/sign-in', { headers: { 'next-action': 'abc123' } });
  expect(html(withAction.headers())).toBe(true);
  expect(nonceOf(withAction.headers()), 'GET with Next-Action').toBe(true);

  const urlencoded = await page.request.post('/sign-in', {
    headers: { 'next-action': 'abc123', origin: baseURL! },
    form: { email: 'x' },
    maxRedirects: 0,
  });
  expect(html(urlencoded.headers()), 'Next answers it with its HTML 404').toBe(true);
  expect(nonceOf(urlencoded.headers()), 'urlencoded POST with Next-Action').toBe(true);

  for (const path of ['/runner-sw-x', '/runner-sw/other.js', '/favicon.icon']) {
    const notFound = await page.request.get(path);
    expect(notFound.status(), path).toBe(404);
    expect(nonceOf(notFound.headers()), path).toBe(true);
  }

  const api = await page.request.get('/api/nope/deeper');
  expect(api.status()).toBe(404);
  expect(api.headers()['content-type']).toContain('application/json');
  expect(await api.json()).toMatchObject({ error: { code: 'not_found' } });
});

test('a server action with a body over 256 kB is refused before it runs', async ({ page }) => {
  // Signed out: the shared lead signs in (a session of this test's own; the shared one is untouched).
  const { email } = sharedPeople().lead;

  // Catch the sign-in action as the form sends it, then send it again with padding added.
  let captured: { url: string; headers: Record<string, string>; body: Buffer } | undefined;
  await page.route('**/sign-in**', async (route) => {
    const request = route.request();
    if (request.method() === 'POST' && request.headers()['next-action']) {
      captured = {
        url: request.url(),
        headers: request.headers(),
        body: request.postDataBuffer() ?? Buffer.alloc(0),
      };
    }
    await route.continue();
  });
  await signIn(page, email);
  await expect(page.getByRole('heading', { name: 'Board' })).toBeVisible();
  expect(captured, 'the sign-in form posts a server action').toBeDefined();
  const { url, headers, body } = captured!;
  const boundary = /boundary=(.+)$/.exec(headers['content-type'] ?? '')?.[1];
  expect(boundary, 'a multipart action body').toBeTruthy();

  const padded = (bytes: number) =>
    Buffer.concat([
      Buffer.from(
        `--${boundary}\r\nContent-Disposition: form-data; name="padding"\r\n\r\n${'x'.repeat(bytes)}\r\n`,
      ),
      body,
    ]);
  const send = (bytes: number) =>
    page.request.post(url, {
      headers: {
        'next-action': headers['next-action']!,
        'content-type': headers['content-type']!,
        origin: new URL(url).origin,
        accept: 'text/x-component',
      },
      data: padded(bytes),
      maxRedirects: 0,
    });
  const small = await send(1024);
  expect(small.status(), 'the same action with a little padding runs').toBeLessThan(400);
  const large = await send(300 * 1024);
  // Next 16 refuses it while reading the body; for a fetch-called action it answers 500 with no result.
  expect(large.status()).toBeGreaterThanOrEqual(400);
});

test('the Mailbox: signed out goes to sign-in; a technician is refused; a lead sees only their own shop’s mail, under a demo banner', async ({
  browser,
}) => {
  const signedOut = await browser.newContext();
  const anonymous = await signedOut.newPage();
  await anonymous.goto('/mailbox');
  // The shop layout sends a signed-out visitor to sign-in, as on every shop page.
  await expect(anonymous.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await expect(anonymous.getByRole('heading', { name: 'Mailbox' })).toHaveCount(0);
  await signedOut.close();

  // Shop A is the shared shop (the invite below is this test's own); shop B is the second shop,
  // whose Mailbox nobody writes to.
  const lead = await contextAs(browser, 'lead');
  const page = lead.page;
  const invitedToA = uniqueEmail('mail-a-invitee');
  await invite(page, invitedToA, 'Technician');
  const tech = await contextAs(browser, 'technician');
  const refused = await tech.page.goto('/mailbox');
  expect(refused?.status()).toBe(403);
  await expect(tech.page.getByRole('heading', { name: 'Not for your role' })).toBeVisible();
  await expect(
    tech.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Mailbox' }),
  ).toHaveCount(0);
  await tech.context.close();

  // The e2e server is a production build with MAILBOX_DEMO=true: the page says it is a demo.
  await mailArrived(invitedToA);
  await page.goto('/mailbox');
  await expect(page.getByText(/Demo server: this Mailbox is switched on/)).toBeVisible();
  await expect(
    page.getByRole('article', { name: new RegExp(`to ${invitedToA.replace(/[.+]/g, '\\$&')}`) }),
  ).toBeVisible();

  await lead.context.close();

  const { context: otherShop, page: leadB } = await contextAs(browser, 'other-lead');
  await leadB.goto('/mailbox');
  await expect(leadB.getByRole('heading', { name: 'Mailbox' })).toBeVisible();
  await expect(leadB.getByText(invitedToA)).toHaveCount(0);
  await expect(leadB.getByRole('article')).toHaveCount(0);
  await otherShop.close();
});
