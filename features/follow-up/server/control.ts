import 'server-only';
import { and, eq, inArray, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { customerReportEmails, jobs, recheckReminders } from '@/db/schema';
import { shopDay } from '@/features/ui/shop-time';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';
import { getJobContact } from './reminder-data';
import { queueRecheckOrMarkFailed, queueReportEmailOrMarkFailed } from './schedule';
import { getFollowUp } from './status';

const reminderOf = (shopId: string, jobId: string) =>
  and(eq(recheckReminders.shopId, shopId), eq(recheckReminders.jobId, jobId));

async function requireJob(shopId: string, jobId: string) {
  const [job] = await getDb()
    .select({ state: jobs.state })
    .from(jobs)
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  if (!job) throw notFound('That job card');
  return job;
}

/** A lead stops a scheduled reminder; its queued job later finds it cancelled and sends nothing. */
export async function cancelRecheck(actor: Member, jobId: string) {
  await requireJob(actor.shopId, jobId);
  const done = await getDb()
    .update(recheckReminders)
    .set({ status: 'cancelled', changedById: actor.userId, updatedAt: new Date() })
    .where(and(reminderOf(actor.shopId, jobId), eq(recheckReminders.status, 'scheduled')))
    .returning({ jobId: recheckReminders.jobId });
  if (!done.length)
    throw new DomainError('conflict', 'Only a scheduled reminder can be cancelled.');
  return getFollowUp(actor.shopId, jobId);
}

/**
 * A lead moves the reminder to another shop day (today or later), also to send it again after it
 * was sent, failed or cancelled. The old queued job carries the old day and will skip itself. If
 * the queue cannot take the new job, the row says `failed` with the reason.
 */
export async function rescheduleRecheck(actor: Member, jobId: string, dueOn: string) {
  const job = await requireJob(actor.shopId, jobId);
  if (job.state !== 'signed_off')
    throw new DomainError('conflict', 'The re-check reminder follows a sign-off.');
  const { timeZone } = await getShopSettings(actor.shopId);
  if (dueOn < shopDay(new Date(), timeZone)) {
    const message = 'Pick today or a later day.';
    throw new DomainError('invalid', message, { dueOn: [message] });
  }
  await getDb()
    .insert(recheckReminders)
    .values({ shopId: actor.shopId, jobId, dueOn, changedById: actor.userId })
    .onConflictDoUpdate({
      target: recheckReminders.jobId,
      set: {
        dueOn,
        status: 'scheduled',
        attempts: 0,
        lastError: null,
        sentAt: null,
        changedById: actor.userId,
        updatedAt: new Date(),
      },
      setWhere: eq(recheckReminders.shopId, actor.shopId),
    });
  // A queue that refuses leaves the row `failed` with the reason, shown to the lead here.
  await queueRecheckOrMarkFailed(actor.shopId, jobId, dueOn, timeZone);
  return getFollowUp(actor.shopId, jobId);
}

/**
 * "Send again": the customer e-mail goes back on the queue to the customer's current address
 * (also the first time, when an address was added after the sign-off). Refused while one waits.
 */
export async function resendReportEmail(actor: Member, jobId: string) {
  const job = await getJobContact(actor.shopId, jobId);
  if (!job) throw notFound('That job card');
  if (job.state !== 'signed_off')
    throw new DomainError('conflict', 'The customer e-mail follows a sign-off.');
  if (!job.email)
    throw new DomainError('invalid', "Add the customer's e-mail address first, then send again.");
  const requeued = await getDb()
    .insert(customerReportEmails)
    .values({ shopId: actor.shopId, jobId, toAddress: job.email })
    .onConflictDoUpdate({
      target: customerReportEmails.jobId,
      set: {
        toAddress: job.email,
        status: 'queued',
        attempts: 0,
        lastError: null,
        queuedAt: sql`now()`,
        updatedAt: new Date(),
      },
      setWhere: and(
        eq(customerReportEmails.shopId, actor.shopId),
        inArray(customerReportEmails.status, ['sent', 'failed']),
      ),
    })
    .returning({ jobId: customerReportEmails.jobId });
  if (!requeued.length)
    throw new DomainError('conflict', 'The e-mail is already waiting to be sent.');
  await queueReportEmailOrMarkFailed(actor.shopId, jobId);
  return getFollowUp(actor.shopId, jobId);
}
