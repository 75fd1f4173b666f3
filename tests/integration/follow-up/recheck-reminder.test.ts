import { and, eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { approveReviewed } from '@/app/(shop)/jobs/[jobId]/review/actions';
import * as jobItem from '@/app/api/jobs/[jobId]/route';
import { defaultDeps, queueHandlers } from '@/app/_worker/handlers';
import { getDb } from '@/db';
import { customers, jobs, recheckReminders, shopSettings, users } from '@/db/schema';
import {
  cancelRecheckReminder,
  rescheduleRecheckReminder,
} from '@/features/follow-up/actions/follow-up-actions';
import { deliverRecheckReminder } from '@/features/follow-up/server/deliver';
import { addDays, shopDay } from '@/features/ui/shop-time';
import type { OutgoingMail } from '@/server/mail/mailer';
import { getBoss, sendJob } from '@/server/queue/boss';
import { startWorker } from '@/server/queue/worker';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { drainQueues } from '@/tests/helpers/queue';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

/**
 * A stand-in mail server that keeps what it was given for one shop (the file's other tests leave
 * their own jobs on this database's queue).
 */
function mailCatcher(shopId: string) {
  const all: OutgoingMail[] = [];
  return {
    get sent() {
      return all.filter((m) => m.shopId === shopId);
    },
    send: async (m: OutgoingMail) => void all.push(m),
  };
}
const REMINDERS = { names: ['recheck-reminder' as const], ignoreStartAfter: true };

async function signedOff(zone = 'America/Denver', recheckDays = 7) {
  const shop = await createTestShop('Follow-up Shop');
  await getDb()
    .update(shopSettings)
    .set({ timeZone: zone, recheckDays })
    .where(eq(shopSettings.shopId, shop.shopId));
  const { job } = await createRecords(shop.lead, shop.technician.userId);
  await awaitingSignoff(shop.shopId, job.id, shop.technician.userId, { at: new Date() });
  await actAs(shop.lead.userId);
  const result = await approveReviewed(null, { jobId: job.id, acknowledgements: [] });
  expect(result).toMatchObject({ ok: true });
  return { shop, jobId: job.id };
}

const reminderRow = async (jobId: string) =>
  (
    await getDb()
      .select({
        dueOn: recheckReminders.dueOn,
        status: recheckReminders.status,
        attempts: recheckReminders.attempts,
        lastError: recheckReminders.lastError,
      })
      .from(recheckReminders)
      .where(eq(recheckReminders.jobId, jobId))
  )[0];

/** The reminder jobs waiting in pg-boss for this job card. */
const queuedReminders = async (jobId: string) =>
  getDb().execute<{ start_after: Date; state: string; singleton_key: string }>(
    sql`select start_after, state, singleton_key from pgboss.job where name = 'recheck-reminder' and data->>'jobId' = ${jobId} order by created_on`,
  );

describe('the re-check reminder', () => {
  it('is scheduled once on sign-off, for the shop’s re-check days later at 09:00 shop time', async () => {
    const { shop, jobId } = await signedOff('America/Denver', 7);
    const dueOn = addDays(shopDay(new Date(), 'America/Denver'), 7);
    expect(await reminderRow(jobId)).toMatchObject({ dueOn, status: 'scheduled', attempts: 0 });
    const jobs = await queuedReminders(jobId);
    expect(jobs).toHaveLength(1);
    // 09:00 in Denver is 16:00 UTC in winter (MST, UTC−7) and 15:00 in summer (MDT, UTC−6).
    const at = new Date(jobs[0]!.start_after);
    expect(shopDay(at, 'America/Denver')).toBe(dueOn);
    expect(at.toLocaleTimeString('en-US', { timeZone: 'America/Denver', hour12: false })).toBe(
      '09:00:00',
    );

    // The job card's API shows it.
    const response = await jobItem.GET(
      apiRequest(`/api/jobs/${jobId}`, { cookie: await cookieFor(shop.lead.userId) }),
      params({ jobId }),
    );
    expect((await response.json()).data.recheck).toEqual({ dueOn, status: 'scheduled' });
  });

  it('sends once: the first run mails every ring bolt’s final torque in sequence, a second run or a second worker sends nothing', async () => {
    const { shop, jobId } = await signedOff();
    const mail = mailCatcher(shop.shopId);
    // Its day has come (as if the clock had moved on): two workers' handlers at the same moment.
    const waiting = await (
      await getBoss()
    ).fetch<{ shopId: string; jobId: string; dueOn: string }>('recheck-reminder', {
      includeMetadata: true,
      ignoreStartAfter: true,
      batchSize: 50,
    });
    const job = waiting.find((j) => j.data.jobId === jobId);
    const attempt = { id: job!.id, retryCount: 0, retryLimit: 5 };
    const outcomes = await Promise.all([
      deliverRecheckReminder(job!.data, attempt, mail.send),
      deliverRecheckReminder(job!.data, attempt, mail.send),
    ]);
    expect(outcomes.sort()).toEqual(['sent', 'skipped']);
    expect(mail.sent).toHaveLength(1);
    const [reminder] = mail.sent;
    expect(reminder!.to).toBe('wren@example.test');
    // The demo spec's final torque in its own unit and the other (NIST SP 811: 1 ft·lbf = 1.355 818 N·m).
    expect(reminder!.text).toMatch(
      /Left front: all \d+ ring bolts at [\d.]+ (ft-lb|N·m) \([\d.]+ (N·m|ft-lb)\), in this order: 1-/,
    );
    expect(reminder!.text).toMatch(/maker's specs, local codes and licensed practice come first/);
    expect(await reminderRow(jobId)).toMatchObject({ status: 'sent', attempts: 1 });

    await drainQueues({ send: mail.send }, REMINDERS);
    expect(mail.sent).toHaveLength(1);
  });

  it('a reminder due a few seconds out is delivered exactly once by two workers, one stopped and restarted in between', async () => {
    const { shop, jobId } = await signedOff();
    const mail = mailCatcher(shop.shopId);
    const { dueOn } = (await reminderRow(jobId))!;
    await sendJob(
      'recheck-reminder',
      { shopId: shop.shopId, jobId, dueOn },
      { startAfter: new Date(Date.now() + 2000), singletonKey: `${jobId}:soon` },
    );
    const handlers = queueHandlers({
      ...defaultDeps,
      send: mail.send,
      composeReportEmail: async () => null,
    });
    const first = await startWorker(handlers, { pollingIntervalSeconds: 0.5 });
    await first.stop();
    const [again, second] = await Promise.all([
      startWorker(handlers, { pollingIntervalSeconds: 0.5 }),
      startWorker(handlers, { pollingIntervalSeconds: 0.5 }),
    ]);
    const deadline = Date.now() + 10_000;
    while ((await reminderRow(jobId))?.status !== 'sent' && Date.now() < deadline)
      await new Promise((r) => setTimeout(r, 200));
    await new Promise((r) => setTimeout(r, 1500)); // give a duplicate the chance to show
    await Promise.all([again.stop(), second.stop()]);
    expect(mail.sent).toHaveLength(1);
    expect(await reminderRow(jobId)).toMatchObject({ status: 'sent' });
  }, 30_000);

  it('a lead cancels it (nothing is sent) and reschedules it to a day (sent then, once)', async () => {
    const { shop, jobId } = await signedOff();
    const mail = mailCatcher(shop.shopId);
    await actAs(shop.lead.userId);
    expect(await cancelRecheckReminder(null, { jobId })).toMatchObject({ ok: true });
    await drainQueues({ send: mail.send }, REMINDERS);
    expect(mail.sent).toHaveLength(0);
    expect((await reminderRow(jobId))?.status).toBe('cancelled');

    const later = addDays(shopDay(new Date(), 'America/Denver'), 30);
    expect(await rescheduleRecheckReminder(null, { jobId, dueOn: later })).toMatchObject({
      ok: true,
      data: { followUp: { recheck: { dueOn: later, status: 'scheduled' } } },
    });
    await drainQueues({ send: mail.send }, REMINDERS);
    expect(mail.sent).toHaveLength(1);
    expect((await reminderRow(jobId))?.status).toBe('sent');
  });

  it('refuses a day in the past, a technician, and another shop’s lead (not found)', async () => {
    const { shop, jobId } = await signedOff();
    await actAs(shop.lead.userId);
    expect(await rescheduleRecheckReminder(null, { jobId, dueOn: '2020-01-01' })).toMatchObject({
      ok: false,
      fieldErrors: { dueOn: ['Pick today or a later day.'] },
    });
    await actAs(shop.technician.userId);
    expect(await cancelRecheckReminder(null, { jobId })).toMatchObject({ code: 'forbidden' });
    const other = await createTestShop('Other Shop');
    await actAs(other.lead.userId);
    expect(await cancelRecheckReminder(null, { jobId })).toMatchObject({ code: 'not_found' });
    expect((await reminderRow(jobId))?.status).toBe('scheduled');
  });

  it('a relay that keeps refusing is retried with backoff, then the reminder ends failed with the reason', async () => {
    const { jobId } = await signedOff();
    const refuse = async () => {
      throw new Error('554 5.7.1 relay refused');
    };
    // Each failed run goes back to pg-boss, which waits longer each time; here the waits are
    // skipped. The first try and 5 retries (server/queue/jobs.ts), then it gives up.
    while (await drainQueues({ send: refuse }, REMINDERS));
    expect(await reminderRow(jobId)).toMatchObject({
      status: 'failed',
      attempts: 6,
      lastError: '554 5.7.1 relay refused',
    });
    expect((await queuedReminders(jobId)).map((j) => j.state)).toEqual(['failed']);
  });

  it('for a customer without an address reaches each lead once, also when the first try was refused', async () => {
    const { shop, jobId } = await signedOff();
    const [job] = await getDb()
      .select({ customerId: jobs.customerId })
      .from(jobs)
      .where(eq(jobs.id, jobId));
    await getDb().update(customers).set({ email: '' }).where(eq(customers.id, job!.customerId));
    const secondLead = shop.technician;
    await getDb().update(users).set({ role: 'lead' }).where(eq(users.id, secondLead.userId));
    // The mail server refuses the first message naming the second lead, then takes everything.
    let refused = false;
    const received: string[] = [];
    const send = async (m: OutgoingMail) => {
      if (m.shopId !== shop.shopId) return;
      if (!refused && m.to.includes(secondLead.email)) {
        refused = true;
        throw new Error('452 4.2.2 mailbox full, try again later');
      }
      received.push(...m.to.split(',').map((to) => to.trim()));
    };
    while (await drainQueues({ send }, REMINDERS));
    expect(refused).toBe(true);
    expect(received.sort()).toEqual([shop.lead.email, secondLead.email].sort());
    expect(await reminderRow(jobId)).toMatchObject({ status: 'sent', attempts: 2 });
  });
});

describe('the reminder row', () => {
  it('is one per job card even when sign-off follow-up runs twice', async () => {
    const { shop, jobId } = await signedOff();
    const { scheduleFollowUp } = await import('@/features/follow-up/server/schedule');
    await scheduleFollowUp(shop.shopId, jobId);
    expect(await queuedReminders(jobId)).toHaveLength(1);
    expect(
      await getDb()
        .select({ jobId: recheckReminders.jobId })
        .from(recheckReminders)
        .where(and(eq(recheckReminders.shopId, shop.shopId), eq(recheckReminders.jobId, jobId))),
    ).toHaveLength(1);
  });
});
