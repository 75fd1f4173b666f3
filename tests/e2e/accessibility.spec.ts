import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { waitForMail } from '../helpers/mailbox';
import { E2E } from '../helpers/test-services';
import { invite, inviteAndJoin, PASSWORD, signUp, uniqueEmail } from './helpers';
import { confirmBolts, startAllBolts } from './runner-helpers';
import { api, stockShop } from './runner-shop';

/**
 * No serious or critical axe violation on the page as it is now. A failure lists each rule with
 * the elements it found, so the fix can start from the message alone.
 */
async function expectAccessible(page: Page, where: string) {
  const { violations, incomplete } = await new AxeBuilder({ page }).analyze();
  if (process.env.AXE_DEBUG)
    console.log(
      where,
      JSON.stringify(
        [...violations, ...incomplete.map((v) => ({ ...v, id: `incomplete:${v.id}` }))].map((v) => [
          v.id,
          v.impact,
          v.nodes.map((n) => [n.target.join(' '), n.failureSummary?.slice(0, 200)]).slice(0, 3),
          v.nodes.length,
        ]),
      ),
    );
  const bad = violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id} (${v.impact}): ${v.nodes.map((n) => n.target.join(' ')).join(' | ')}`);
  expect(bad, `axe on ${where} (${page.url()})`).toEqual([]);
  // axe does not read the text drawn inside an SVG button (the bolt circle): the same rule as
  // its label-content-name-mismatch, by hand — every word drawn is in the name, in order.
  const mismatched = await page.evaluate(() => {
    const words = (s: string) =>
      s
        .toLowerCase()
        .split(/[^a-z0-9]+/)
        .filter(Boolean);
    return [...document.querySelectorAll('svg [role=button]')].flatMap((el) => {
      const name = words(el.getAttribute('aria-label') ?? '');
      const drawn = [...el.querySelectorAll('text')].flatMap((t) => words(t.textContent ?? ''));
      const inName = name.some((_, i) => drawn.every((w, j) => name[i + j] === w));
      return inName ? [] : [`"${drawn.join(' ')}" not in "${el.getAttribute('aria-label')}"`];
    });
  });
  expect(mismatched, `label in name on ${where}`).toEqual([]);
}

async function visit(page: Page, path: string, heading: string | RegExp) {
  await page.goto(path);
  await expect(page.getByRole('heading', { name: heading, level: 1 })).toBeVisible();
  await expectAccessible(page, path);
}

/** Sign-up through the pages, axe on each: the form, its answer, the link's page. */
async function signUpChecked(page: Page, shopName: string, name: string) {
  const email = uniqueEmail('lead');
  await visit(page, '/sign-in', 'Sign in');
  await visit(page, '/sign-up', /Create your shop|Sign up/);
  await page.getByLabel('Shop name').fill(shopName);
  await page.getByLabel('Your name').fill(name);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Create shop' }).click();
  await expect(page.getByRole('status')).toContainText('Check your e-mail');
  await expectAccessible(page, 'sign-up, link sent');
  const mail = await waitForMail(E2E.sink.dir, email);
  const link = /https?:\/\/\S+\/sign-up\/[A-Za-z0-9_-]+/.exec(mail.text)?.[0];
  await page.goto(new URL(link!).pathname);
  await expectAccessible(page, 'sign-up, finish');
  await page.getByRole('button', { name: `Create ${shopName} and sign in` }).click();
  await expect(page.getByRole('heading', { name: 'Board' })).toBeVisible();
}

/** A verified wrench, an 8-bolt spec and a one-wheel job (directional tire) for `assigneeId`. */
async function setUpJob(page: Page, assigneeId: string) {
  const { wrenchIds, specId, job, wheelId } = await stockShop(page, { assigneeId });
  return { wrenchId: wrenchIds[0]!, specId, job, wheelId };
}

async function withTechnician(page: Page, browser: Browser) {
  const tech = await inviteAndJoin(page, browser, uniqueEmail('tech'), 'Tam Tech', 'Technician');
  const members = await api<{ id: string; name: string }[]>(page, 'GET', '/api/team/members');
  return { ...tech, id: members.find((m) => m.name === 'Tam Tech')!.id };
}

test('every page, as the role that sees it, has no serious or critical axe violation', async ({
  page,
  browser,
}) => {
  test.setTimeout(180_000);
  await signUpChecked(page, 'Clear Sight Tires', 'Rae Lead');
  const tech = await withTechnician(page, browser);
  const { wrenchId, specId, job } = await setUpJob(page, tech.id);

  await visit(page, '/board', 'Board');
  await visit(page, '/jobs/new', /New job card/);
  await visit(page, `/jobs/${job.id}`, /^Job #\d+/);
  await visit(page, `/jobs/${job.id}/review`, /Review|Job #/);
  await visit(page, '/customers', 'Customers');
  await page
    .getByRole('link', { name: /Ada Offroad/ })
    .first()
    .click();
  await expect(page.getByRole('heading', { name: /Ada Offroad/, level: 1 })).toBeVisible();
  await expectAccessible(page, 'customer');
  await visit(page, '/specs', /Specs|Wheel specs/);
  await visit(page, '/specs/new', /New/);
  await visit(page, `/specs/${specId}`, /8-bolt test ring/);
  await visit(page, '/tool-crib', 'Tool crib');
  await visit(page, '/tool-crib/new', /New|Add/);
  await visit(page, `/tool-crib/${wrenchId}`, /Blue click/);
  await visit(page, '/team', 'Team');
  await visit(page, `/team/${tech.id}`, 'Tam Tech');
  // The confirmation dialog, open over the page.
  await page.getByRole('button', { name: 'Remove from team' }).click();
  await expect(
    page.getByRole('alertdialog', { name: 'Remove Tam Tech from the team?' }),
  ).toBeVisible();
  await expectAccessible(page, 'remove-member dialog');
  await page.keyboard.press('Escape');
  await expect(page.getByRole('alertdialog')).toBeHidden();
  await visit(page, '/settings', 'Settings');
  await page.getByRole('button', { name: /Save/ }).first().click();
  await expect(page.getByRole('status').first()).toContainText('Settings saved');
  await expect(
    page.locator('[data-sonner-toast]').filter({ hasText: 'Settings saved' }),
  ).toBeVisible();
  await expectAccessible(page, 'settings, saved (inline message and toast)');
  await visit(page, '/practice', 'Practice');
  await page.getByRole('combobox', { name: 'Wheel' }).selectOption(specId);
  await page.getByRole('button', { name: 'Start the attempt' }).click();
  await page.waitForURL(/\/practice\/attempts\/[0-9a-f-]+$/);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expectAccessible(page, 'practice attempt, first step');
  await visit(page, '/practice/progress', 'Practice progress');
  await visit(page, '/signoff', 'Sign-off');
  await visit(page, '/mailbox', 'Mailbox');
  const missing = await page.goto('/jobs/00000000-0000-4000-8000-000000000000');
  expect(missing?.status()).toBe(404);
  await expectAccessible(page, '404');

  const t = tech.page;
  await visit(t, '/my-wheels', 'My wheels');
  const refused = await t.goto('/team');
  expect(refused?.status()).toBe(403);
  await expectAccessible(t, '403');
  await tech.context.close();
});

test('every step of the runner, on a phone, has no serious or critical axe violation; so does the review with its send-back dialog', async ({
  page,
  browser,
}) => {
  test.setTimeout(240_000);
  await signUpChecked(page, 'Runner Sight Tires', 'Rae Lead');
  const tech = await withTechnician(page, browser);
  const { job, wheelId } = await setUpJob(page, tech.id);
  const t = tech.page;
  await t.setViewportSize({ width: 360, height: 640 });
  await t.goto(`/jobs/${job.id}/wheels/${wheelId}/run`);

  // The runner's first load on a busy two-core machine can take longer than the usual 5 s.
  await expect(t.getByRole('heading', { name: /Safety gate/ })).toBeVisible({ timeout: 20_000 });
  const tickAndDone = async (heading: RegExp) => {
    await expect(t.getByRole('heading', { name: heading })).toBeVisible();
    await expectAccessible(t, `runner: ${heading.source}`);
    for (const box of await t.locator('main input[type=checkbox]').all()) await box.check();
    await expectAccessible(t, `runner: ${heading.source}, ticked`);
    await t.getByRole('button', { name: 'Step done' }).click();
  };
  await tickAndDone(/Safety gate/);
  await tickAndDone(/Clean/);
  await tickAndDone(/Inspect rim/);
  await tickAndDone(/Mount the tire/);
  await tickAndDone(/Index the ring/);

  await expect(t.getByRole('button', { name: /^Bolt \d+ started by hand$/ })).toBeVisible();
  await expectAccessible(t, 'runner: hand-start');
  await startAllBolts(t);

  await expect(t.getByRole('button', { name: 'Wrench set' })).toBeVisible();
  await expectAccessible(t, 'runner: pass 1, setting card');
  await confirmBolts(t, 1);
  await expectAccessible(t, 'runner: pass 1, one bolt confirmed');
  await confirmBolts(t, 23); // the rest of passes 1 to 3
  await t.getByRole('button', { name: 'Wrench set' }).click();
  await expect(t.getByRole('button', { name: /^Turned$/ })).toBeVisible();
  await expectAccessible(t, 'runner: check pass');
  await confirmBolts(t);
  await t.getByRole('button', { name: 'Torque passes done' }).click();

  await expect(t.getByRole('heading', { name: /Seat the bead/ })).toBeVisible();
  await expectAccessible(t, 'runner: seat the bead');
  const jpeg = await t.evaluate(async () => {
    const c = document.createElement('canvas');
    c.width = 1200;
    c.height = 800;
    const g = c.getContext('2d')!;
    g.fillStyle = '#333';
    g.fillRect(0, 0, c.width, c.height);
    const blob = await new Promise<Blob>((r) => c.toBlob((b) => r(b!), 'image/jpeg', 0.9));
    return Array.from(new Uint8Array(await blob.arrayBuffer()));
  });
  const photo = { name: 'bead.jpg', mimeType: 'image/jpeg', buffer: Buffer.from(jpeg) };
  for (const face of ['outer', 'inner']) {
    await t
      .getByLabel(`Take or choose a photo — Seated bead, ${face} face (required)`)
      .setInputFiles(photo);
    await expect(t.getByRole('img', { name: `Seated bead, ${face} face` })).toBeVisible({
      timeout: 20_000,
    });
  }
  for (const box of await t.locator('main input[type=checkbox]').all()) await box.check();
  await t.getByLabel('Highest pressure used to seat the bead').fill('22');
  await expectAccessible(t, 'runner: seat the bead, photos in');
  await t.getByRole('button', { name: 'Step done' }).click();

  await expect(t.getByRole('heading', { name: /Leak check/ })).toBeVisible();
  await expectAccessible(t, 'runner: leak check');
  for (const box of await t.locator('main input[type=checkbox]').all()) await box.check();
  await t.getByLabel('Pressure set').fill('8');
  await t.getByRole('button', { name: 'Step done' }).click();
  await expect(t.getByRole('button', { name: 'Submit the wheel' })).toBeVisible();
  await expectAccessible(t, 'runner: summary');
  await t.getByRole('button', { name: 'Submit the wheel' }).click();
  await expect(
    t.getByRole('status').filter({ hasText: 'the job card went to sign-off' }),
  ).toBeVisible();
  await expectAccessible(t, 'runner: submitted');
  await tech.context.close();

  await visit(page, `/jobs/${job.id}/review`, /Review|Job #/);
  const sendBack = page.getByRole('form', { name: 'Send back' });
  await sendBack.getByLabel('Send back the LF wheel').check();
  await sendBack.getByRole('button', { name: 'Send back' }).click();
  await expect(page.getByRole('alertdialog', { name: 'Send back the LF wheel?' })).toBeVisible();
  await expectAccessible(page, 'review, send-back dialog');
  await page.keyboard.press('Escape');
  await expect(page.getByRole('alertdialog')).toBeHidden();
});

test('destructive team actions ask in a dialog from the keyboard: Escape keeps the invite, confirming revokes it; removing a member names them and toasts', async ({
  page,
  browser,
}) => {
  test.setTimeout(120_000);
  await signUp(page, 'Second Thought Tires', 'Rae Lead', uniqueEmail('lead'));
  const invited = uniqueEmail('invitee');
  await invite(page, invited, 'Apprentice');
  const revoke = page.getByRole('button', { name: `Revoke the invite to ${invited}` });
  await revoke.focus();
  await page.keyboard.press('Enter');
  const dialog = page.getByRole('alertdialog', { name: `Revoke the invite to ${invited}?` });
  await expect(dialog.getByRole('button', { name: 'Cancel' })).toBeFocused();
  await page.keyboard.press('Escape');
  await expect(dialog).toBeHidden();
  const pending = page.getByRole('region', { name: /Pending invites/ });
  await expect(pending.getByText(invited)).toBeVisible(); // nothing was revoked
  await revoke.click();
  await dialog.getByRole('button', { name: 'Revoke invite' }).click();
  await expect(pending.getByText(invited)).toBeHidden();
  await expect(
    page
      .locator('[data-sonner-toast]')
      .filter({ hasText: `The invite to ${invited} was revoked.` }),
  ).toBeVisible();

  const tech = await withTechnician(page, browser);
  await tech.context.close();
  await page.goto(`/team/${tech.id}`);
  await page.getByRole('button', { name: 'Remove from team' }).click();
  await page
    .getByRole('alertdialog', { name: 'Remove Tam Tech from the team?' })
    .getByRole('button', { name: 'Remove Tam Tech' })
    .click();
  await expect(page).toHaveURL(/\/team$/);
  await expect(
    page.locator('[data-sonner-toast]').filter({ hasText: 'Tam Tech was removed from the team.' }),
  ).toBeVisible();
  await expect(page.getByRole('link', { name: /Tam Tech/ })).toHaveCount(0);
});
