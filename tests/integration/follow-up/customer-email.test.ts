import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { approveReviewed } from '@/app/(shop)/jobs/[jobId]/review/actions';
import * as jobItem from '@/app/api/jobs/[jobId]/route';
import { getDb } from '@/db';
import { customerReportEmails, customers } from '@/db/schema';
import { sendCustomerEmailAgain } from '@/features/follow-up/actions/follow-up-actions';
import type { ReportEmailComposer } from '@/features/follow-up/server/deliver';
import { listActiveReportLinks } from '@/features/reports/server/report-links';
import type { OutgoingMail } from '@/server/mail/mailer';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { drainQueues } from '@/tests/helpers/queue';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

// A stand-in for the reports feature's composer: the delivery is what is tested here.
const compose: ReportEmailComposer = async (shopId, jobId) => {
  const [row] = await getDb()
    .select({ to: customerReportEmails.toAddress })
    .from(customerReportEmails)
    .where(eq(customerReportEmails.jobId, jobId));
  return {
    to: row!.to,
    subject: `Your completion report (${shopId.slice(0, 4)})`,
    html: '<p>Report attached.</p>',
    text: 'Report attached.',
    attachments: [
      { filename: 'report.pdf', content: Buffer.from('%PDF-1.7'), contentType: 'application/pdf' },
    ],
  };
};
const EMAILS = { names: ['customer-report-email' as const], ignoreStartAfter: true };

async function signedOff(email = 'wren@example.test') {
  const shop = await createTestShop('Report Mail Shop');
  const { job, customer } = await createRecords(shop.lead, shop.technician.userId);
  await getDb().update(customers).set({ email }).where(eq(customers.id, customer.id));
  await awaitingSignoff(shop.shopId, job.id, shop.technician.userId, { at: new Date() });
  await actAs(shop.lead.userId);
  expect(await approveReviewed(null, { jobId: job.id, acknowledgements: [] })).toMatchObject({
    ok: true,
  });
  return { shop, jobId: job.id };
}

const emailRow = async (jobId: string) =>
  (
    await getDb()
      .select({
        status: customerReportEmails.status,
        attempts: customerReportEmails.attempts,
        lastError: customerReportEmails.lastError,
        sentAt: customerReportEmails.sentAt,
      })
      .from(customerReportEmails)
      .where(eq(customerReportEmails.jobId, jobId))
  )[0];

const apiView = async (userId: string, jobId: string) =>
  (
    await (
      await jobItem.GET(
        apiRequest(`/api/jobs/${jobId}`, { cookie: await cookieFor(userId) }),
        params({ jobId }),
      )
    ).json()
  ).data;

describe('the customer’s completion e-mail', () => {
  it('is queued on sign-off and sent once from the queue, with the report attached', async () => {
    const { shop, jobId } = await signedOff();
    expect(await emailRow(jobId)).toMatchObject({ status: 'queued', attempts: 0 });
    const sent: OutgoingMail[] = [];
    const send = async (m: OutgoingMail) => void sent.push(m);
    await drainQueues({ send, composeReportEmail: compose }, EMAILS);
    await drainQueues({ send, composeReportEmail: compose }, EMAILS);
    const mine = sent.filter((m) => m.shopId === shop.shopId);
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({
      to: 'wren@example.test',
      attachments: [{ filename: 'report.pdf', contentType: 'application/pdf' }],
    });
    expect(await emailRow(jobId)).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
    expect((await apiView(shop.lead.userId, jobId)).customerEmail).toMatchObject({
      status: 'sent',
      lastError: null,
    });
  });

  it('is not queued for a customer without an address', async () => {
    const { jobId } = await signedOff('');
    expect(await emailRow(jobId)).toBeUndefined();
  });

  it('ends failed with the reason after the retries, and a lead’s "Send again" delivers it', async () => {
    const { shop, jobId } = await signedOff();
    const refuse = async () => {
      throw new Error('421 4.7.0 try again later');
    };
    while (await drainQueues({ send: refuse, composeReportEmail: compose }, EMAILS));
    expect(await emailRow(jobId)).toMatchObject({
      status: 'failed',
      attempts: 6,
      lastError: '421 4.7.0 try again later',
    });
    expect((await apiView(shop.technician.userId, jobId)).customerEmail).toMatchObject({
      status: 'failed',
      lastError: '421 4.7.0 try again later',
    });

    await actAs(shop.technician.userId);
    expect(await sendCustomerEmailAgain(null, { jobId })).toMatchObject({ code: 'forbidden' });
    await actAs((await createTestShop('Other Shop')).lead.userId);
    expect(await sendCustomerEmailAgain(null, { jobId })).toMatchObject({ code: 'not_found' });

    await actAs(shop.lead.userId);
    expect(await sendCustomerEmailAgain(null, { jobId })).toMatchObject({
      ok: true,
      data: { followUp: { customerEmail: { status: 'queued', lastError: null } } },
    });
    // A second click while it waits is refused, not queued twice.
    expect(await sendCustomerEmailAgain(null, { jobId })).toMatchObject({ code: 'conflict' });
    const sent: OutgoingMail[] = [];
    await drainQueues(
      { send: async (m) => void sent.push(m), composeReportEmail: compose },
      EMAILS,
    );
    expect(sent.filter((m) => m.shopId === shop.shopId)).toHaveLength(1);
    expect(await emailRow(jobId)).toMatchObject({ status: 'sent', lastError: null });
  });

  it('with the reports feature’s own composer: the PDF attached and the customer’s link inside', async () => {
    const { shop, jobId } = await signedOff();
    const sent: OutgoingMail[] = [];
    await drainQueues({ send: async (m) => void sent.push(m) }, EMAILS);
    const [mail] = sent.filter((m) => m.shopId === shop.shopId);
    expect(mail?.to).toBe('wren@example.test');
    expect(mail?.text).toMatch(/\/r\/[A-Za-z0-9_-]{20,}/);
    expect(mail?.attachments?.[0]?.contentType).toBe('application/pdf');
    expect(mail?.attachments?.[0]?.content.subarray(0, 5).toString()).toBe('%PDF-');
    expect(await emailRow(jobId)).toMatchObject({ status: 'sent' });
  }, 30_000);

  it('leaves no customer link open for an attempt whose e-mail the mail server refused', async () => {
    const { shop, jobId } = await signedOff();
    const refuse = async () => {
      throw new Error('451 4.3.0 mail server busy, try again later');
    };
    while (await drainQueues({ send: refuse }, EMAILS));
    expect(await emailRow(jobId)).toMatchObject({ status: 'failed' });
    expect(await listActiveReportLinks(shop.shopId, jobId)).toEqual([]);
  }, 60_000);
});
