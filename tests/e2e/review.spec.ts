import { expect, test } from '@playwright/test';
import { waitForMail } from '../helpers/mailbox';
import { E2E } from '../helpers/test-services';
import { inviteAndJoin, signUp, uniqueEmail } from './helpers';
import { runWheelFast, tapThroughPasses } from './runner-helpers';
import { api, stockShop } from './runner-shop';

/**
 * The newest mail to `to`, once it is the one with `subject`: notices go out after the change
 * commits, so right after the screen changes the newest mail may still be an earlier one.
 */
async function mailAbout(to: string, subject: string) {
  let newest = await waitForMail(E2E.sink.dir, to);
  await expect
    .poll(async () => (newest = await waitForMail(E2E.sink.dir, to)).subject, { timeout: 15_000 })
    .toBe(subject);
  return newest;
}

test('a wheel run too fast: the lead sees it first on the review, sends the wheel back, the technician redoes the passes, the lead signs off with a reason; both e-mails arrive', async ({
  page,
  browser,
}) => {
  test.setTimeout(240_000);
  const leadEmail = uniqueEmail('lead');
  await signUp(page, 'Quick Hands Rim Shop', 'Rae Lead', leadEmail);
  const techEmail = uniqueEmail('tech');
  const tech = await inviteAndJoin(page, browser, techEmail, 'Tam Tech', 'Technician');
  const techId = (await api<{ id: string; name: string }[]>(page, 'GET', '/api/team/members')).find(
    (m) => m.name === 'Tam Tech',
  )!.id;

  // A wrench verified near each working point (the shop's default: ±25 % of the setting), an 8-bolt spec, a one-wheel job for the technician.
  const { job, wheelId } = await stockShop(page, { assigneeId: techId, directional: false });

  await runWheelFast(tech.page, job.id, wheelId);
  const waiting = await mailAbout(leadEmail, `Job ${job.number} is waiting for sign-off`);
  expect(waiting.text).toContain(`/jobs/${job.id}/review`);

  // The lead: the nav counts the job, the queue lists it, the review shows the anomaly first.
  expect((await api<{ count: number }>(page, 'GET', '/api/signoff-queue')).count).toBe(1);
  await page.goto('/board');
  const nav = page.getByRole('navigation', { name: 'Main' });
  await expect(nav.getByRole('link', { name: /^Sign-off/ })).toBeVisible();
  await expect(nav.getByRole('link', { name: /^Sign-off/ })).toHaveAccessibleName(
    /^Sign-off ?\(1 waiting\)$/,
    { timeout: 10_000 },
  );
  await nav.getByRole('link', { name: /^Sign-off/ }).click();
  await expect(page.getByRole('heading', { name: 'Sign-off' })).toBeVisible();
  await page.getByRole('link', { name: `Job ${job.number} · Ada Offroad` }).click();
  const first = page.getByRole('list', { name: 'Anomalies' }).getByRole('listitem').first();
  await expect(first).toContainText('Blocks sign-off');
  await expect(first).toContainText(
    /LF wheel: pass 1 of 4 \(30 %, 3\.6 ft-lb\) was confirmed at a median of [\d.]+ s per bolt, faster than the shop's 1\.5 s/,
  );

  const sendBack = page.getByRole('form', { name: 'Send back' });
  await sendBack.getByLabel('Send back the LF wheel').check();
  await sendBack
    .getByLabel('What to redo on the LF wheel')
    .fill('Redo every pass: pull each bolt to the click.');
  await sendBack.getByLabel('Torque passes').check();
  await sendBack.getByRole('button', { name: 'Send back' }).click();
  await page
    .getByRole('alertdialog', { name: 'Send back the LF wheel?' })
    .getByRole('button', { name: 'Send back the LF wheel' })
    .click();
  await expect(page.getByRole('status').filter({ hasText: 'Sent back by Rae Lead' })).toContainText(
    'LF: Redo every pass: pull each bolt to the click.',
  );
  const back = await mailAbout(techEmail, `Job ${job.number} was sent back: LF`);
  expect(back.text).toContain(
    'LF wheel: Redo every pass: pull each bolt to the click. (redo: torque)',
  );

  // The technician: the note on top, only the passes to redo, then submit again.
  const t = tech.page;
  await t.goto(`/jobs/${job.id}/wheels/${wheelId}/run`);
  await expect(t.getByRole('alert', { name: 'Sent back by the lead' })).toContainText(
    'Redo every pass: pull each bolt to the click.',
  );
  await tapThroughPasses(t);
  await t.getByRole('button', { name: 'Submit the wheel' }).click();
  await expect(
    t.getByRole('status').filter({ hasText: 'the job card went to sign-off' }),
  ).toBeVisible();

  // Still too fast: the lead may accept it only with a reason, which the record keeps.
  await page.goto(`/jobs/${job.id}/review`);
  const approve = page.getByRole('form', { name: 'Sign off' });
  await approve.getByRole('button', { name: 'Sign off' }).click();
  await expect(
    page
      .getByRole('alert')
      .filter({ hasText: 'Acknowledge every anomaly that blocks sign-off with a reason first.' }),
  ).toBeVisible();
  for (const box of await approve
    .getByPlaceholder('Why this is acceptable (kept on the record)')
    .all())
    await box.fill('Watched the second run myself; every bolt clicked.');
  await approve.getByRole('button', { name: 'Sign off' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'Signed off by Rae Lead' }),
  ).toContainText('Reason: Watched the second run myself; every bolt clicked.');
  await expect(page.getByRole('region', { name: 'Acknowledged at sign-off' })).toContainText(
    'Reason: Watched the second run myself; every bolt clicked. — Rae Lead',
  );
  await page.goto(`/jobs/${job.id}`);
  await expect(page.getByText('Signed off').first()).toBeVisible();
  await expect(page.getByText(/Acknowledged: LF wheel: pass 1 of 4/).first()).toBeVisible();
  await tech.context.close();
});
