import { expect, test } from '@playwright/test';
import { waitForMail } from '../helpers/mailbox';
import { E2E } from '../helpers/test-services';
import { inviteAndJoin, signUp, uniqueEmail } from './helpers';
import { runWheelFast } from './runner-helpers';
import { api, stockShop } from './runner-shop';

// The e2e database holds no demo shop, so the test signs up a shop of its own and runs its job.
test.use({ viewport: { width: 360, height: 640 } });

test('signed off, the customer gets the e-mail with the report link; opened on a phone with no account it shows the wheel, the PDF opens, an altered link is not found', async ({
  page,
  browser,
}) => {
  test.setTimeout(240_000);
  await signUp(page, 'Paperwork Beadlocks', 'Rita Lead', uniqueEmail('lead'));
  const tech = await inviteAndJoin(page, browser, uniqueEmail('tech'), 'Tobi Tech', 'Technician');
  const techId = (await api<{ id: string; name: string }[]>(page, 'GET', '/api/team/members')).find(
    (m) => m.name === 'Tobi Tech',
  )!.id;
  const customerEmail = uniqueEmail('customer');
  const { job, wheelId } = await stockShop(page, {
    assigneeId: techId,
    directional: false,
    customerEmail,
  });
  await runWheelFast(tech.page, job.id, wheelId);
  await tech.context.close();

  // The passes were tapped faster than a wrench clicks: the lead signs off with a reason.
  await page.goto(`/jobs/${job.id}/review`);
  const approve = page.getByRole('form', { name: 'Sign off' });
  const reason = approve.getByPlaceholder('Why this is acceptable (kept on the record)');
  await expect(reason.first()).toBeVisible();
  for (const box of await reason.all())
    await box.fill('Checked every bolt with the wrench myself.');
  await approve.getByRole('button', { name: 'Sign off' }).click();
  await expect(
    page.getByRole('status').filter({ hasText: 'Signed off by Rita Lead' }),
  ).toBeVisible();

  // The queue's worker sends it after the sign-off commits.
  const mail = await waitForMail(E2E.sink.dir, customerEmail, 30_000);
  expect(mail.subject).toBe(
    `Your completion report: job ${job.number}, Boreal Scout (Paperwork Beadlocks)`,
  );
  expect(mail.text).toContain('is attached, and online for 90 days at:');
  expect(mail.attachments).toEqual([
    expect.objectContaining({
      filename: `job-${job.number}-report.pdf`,
      contentType: 'application/pdf',
      size: expect.any(Number),
    }),
  ]);
  expect(mail.attachments![0]!.size).toBeGreaterThan(5_000);
  const link = /https?:\/\/\S+\/r\/[A-Za-z0-9_-]{43}/.exec(mail.text)?.[0];
  expect(link, mail.text).toBeTruthy();
  const path = new URL(link!).pathname;

  // The customer's phone: a fresh context, no cookies, no session.
  const phone = await browser.newContext({ viewport: { width: 360, height: 640 } });
  const customer = await phone.newPage();
  await customer.goto(path);
  await expect(
    customer.getByRole('heading', { name: `Job ${job.number} completion report` }),
  ).toBeVisible();
  const wheel = customer.getByRole('region', { name: 'LF wheel' });
  await expect(wheel.getByRole('heading', { name: /^LF · / })).toBeVisible();
  // 12 lbf·ft × 1.355818 N·m per lbf·ft = 16.27 N·m (NIST SP 811 App. B), shown to one decimal.
  await expect(wheel).toContainText(/Final torque\s*12 ft-lb \(16\.3 N·m\)/);
  await expect(wheel).toContainText('8 × M8×1.25');

  const pdfHref = await customer
    .getByRole('link', { name: 'Open the PDF report' })
    .getAttribute('href');
  expect(pdfHref).toBe(`${path}/report.pdf`);
  const pdf = await phone.request.get(pdfHref!);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()['content-type']).toContain('application/pdf');
  expect((await pdf.body()).subarray(0, 5).toString('latin1')).toBe('%PDF-');

  // One character changed: the plain not-found page, nothing about the job.
  const last = path.at(-1)!;
  const altered = path.slice(0, -1) + (last === 'A' ? 'B' : 'A');
  const missing = await customer.goto(altered);
  expect(missing?.status()).toBe(404);
  await expect(customer.getByRole('heading', { name: 'Report not found' })).toBeVisible();
  await expect(customer.getByText('Ada Offroad')).toHaveCount(0);
  await phone.close();
});
