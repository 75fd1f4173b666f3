import { eq } from 'drizzle-orm';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { approveReviewed } from '@/app/(shop)/jobs/[jobId]/review/actions';
import { getDb } from '@/db';
import { customerReportEmails, recheckReminders } from '@/db/schema';
import type * as QueueBoss from '@/server/queue/boss';
import {
  rescheduleRecheckReminder,
  sendCustomerEmailAgain,
} from '@/features/follow-up/actions/follow-up-actions';
import { addDays, shopDay } from '@/features/ui/shop-time';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

// The queue refuses jobs named in `queueDown` while it is set; everything else goes through.
const state = vi.hoisted(() => ({ queueDown: null as string | null }));
vi.mock('@/server/queue/boss', async (importOriginal) => {
  const boss = await importOriginal<typeof QueueBoss>();
  return {
    ...boss,
    sendJob: (async (name: string, ...rest: unknown[]) => {
      if (name === state.queueDown) throw new Error('connect ECONNREFUSED 127.0.0.1:5432');
      return (boss.sendJob as (...a: unknown[]) => Promise<unknown>)(name, ...rest);
    }) as typeof boss.sendJob,
  };
});
afterEach(() => {
  state.queueDown = null;
});

describe('a lead reschedules the re-check reminder while the queue is down', () => {
  it('sees it failed with the reason, not scheduled with nothing queued behind it', async () => {
    const shop = await createTestShop('Queue Down Shop');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await awaitingSignoff(shop.shopId, job.id, shop.technician.userId, { at: new Date() });
    await actAs(shop.lead.userId);
    expect(await approveReviewed(null, { jobId: job.id, acknowledgements: [] })).toMatchObject({
      ok: true,
    });

    state.queueDown = 'recheck-reminder';
    const later = addDays(shopDay(new Date(), 'UTC'), 30);
    const result = await rescheduleRecheckReminder(null, { jobId: job.id, dueOn: later });
    expect(result).toMatchObject({
      ok: true,
      data: { followUp: { recheck: { dueOn: later, status: 'failed' } } },
    });
    const [row] = await getDb()
      .select({ status: recheckReminders.status, lastError: recheckReminders.lastError })
      .from(recheckReminders)
      .where(eq(recheckReminders.jobId, job.id));
    expect(row).toMatchObject({ status: 'failed' });
    expect(row!.lastError).toMatch(/Could not be queued: connect ECONNREFUSED/);
  });

  it('"Send again" while the queue is down leaves the e-mail failed with the reason, not waiting for ever', async () => {
    const shop = await createTestShop('Queue Down Mail Shop');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await awaitingSignoff(shop.shopId, job.id, shop.technician.userId, { at: new Date() });
    await actAs(shop.lead.userId);
    expect(await approveReviewed(null, { jobId: job.id, acknowledgements: [] })).toMatchObject({
      ok: true,
    });
    // As after a send that failed every retry.
    await getDb()
      .update(customerReportEmails)
      .set({ status: 'failed', lastError: 'relay refused' })
      .where(eq(customerReportEmails.jobId, job.id));

    state.queueDown = 'customer-report-email';
    expect(await sendCustomerEmailAgain(null, { jobId: job.id })).toMatchObject({
      ok: true,
      data: { message: expect.stringMatching(/could not be queued/) },
    });
    const [row] = await getDb()
      .select({ status: customerReportEmails.status, lastError: customerReportEmails.lastError })
      .from(customerReportEmails)
      .where(eq(customerReportEmails.jobId, job.id));
    expect(row).toMatchObject({ status: 'failed' });
    expect(row!.lastError).toMatch(/Could not be queued: connect ECONNREFUSED/);
  });
});
