import { eq } from 'drizzle-orm';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { approveReviewed } from '@/app/(shop)/jobs/[jobId]/review/actions';
import { getDb } from '@/db';
import { recheckReminders } from '@/db/schema';
import type * as QueueBoss from '@/server/queue/boss';
import { rescheduleRecheckReminder } from '@/features/follow-up/actions/follow-up-actions';
import { addDays, shopDay } from '@/features/ui/shop-time';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

// The queue refuses re-check reminder jobs while `queueDown` is set; everything else goes through.
const state = vi.hoisted(() => ({ queueDown: false }));
vi.mock('@/server/queue/boss', async (importOriginal) => {
  const boss = await importOriginal<typeof QueueBoss>();
  return {
    ...boss,
    sendJob: (async (name: string, ...rest: unknown[]) => {
      if (state.queueDown && name === 'recheck-reminder')
        throw new Error('connect ECONNREFUSED 127.0.0.1:5432');
      return (boss.sendJob as (...a: unknown[]) => Promise<unknown>)(name, ...rest);
    }) as typeof boss.sendJob,
  };
});
afterEach(() => {
  state.queueDown = false;
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

    state.queueDown = true;
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
});
