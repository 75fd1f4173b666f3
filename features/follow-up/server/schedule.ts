import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { customerReportEmails, recheckReminders } from '@/db/schema';
import { sendJob } from '@/server/queue/boss';
import { getShopSettings } from '@/server/shop/settings';
import { recheckDueOn, reminderKey, reminderSendsAt } from '../recheck-due';
import { failureReason } from './deliver';
import { getJobContact } from './reminder-data';

/** Queues the reminder for its day, 09:00 shop time; keyed by job and day. */
export async function queueRecheckReminder(
  shopId: string,
  jobId: string,
  dueOn: string,
  timeZone: string,
) {
  await sendJob(
    'recheck-reminder',
    { shopId, jobId, dueOn },
    { startAfter: reminderSendsAt(dueOn, timeZone), singletonKey: reminderKey(jobId, dueOn) },
  );
}

/**
 * Queues the reminder, or, when the queue cannot take it, marks the row `failed` with the reason
 * (a row saying `scheduled` with no job behind it would never send and never say so).
 */
export async function queueRecheckOrMarkFailed(
  shopId: string,
  jobId: string,
  dueOn: string,
  timeZone: string,
) {
  await guard(recheckFailed(shopId, jobId), () =>
    queueRecheckReminder(shopId, jobId, dueOn, timeZone),
  );
}

export async function queueReportEmail(shopId: string, jobId: string) {
  await sendJob('customer-report-email', { shopId, jobId }, { singletonKey: jobId });
}

/** Queues the customer e-mail; a queue that refuses leaves the row `failed` with the reason, never `queued` with nothing behind it. */
export async function queueReportEmailOrMarkFailed(shopId: string, jobId: string) {
  await guard(emailFailed(shopId, jobId), () => queueReportEmail(shopId, jobId));
}

/**
 * What a sign-off owes the customer, called after it commits: the re-check reminder (the shop's
 * re-check days after the sign-off's shop day) and, when the customer has an address, the
 * completion e-mail. Each row is made once per job (its primary key), so a repeated call queues
 * nothing new. Never throws: the sign-off stands; a row that could not be queued says so as
 * `failed`, where a lead sees it and can reschedule or send again.
 */
export async function scheduleFollowUp(
  shopId: string,
  jobId: string,
  signedOffAt = new Date(),
): Promise<void> {
  const db = getDb();
  try {
    const [{ timeZone, recheckDays }, job] = await Promise.all([
      getShopSettings(shopId),
      getJobContact(shopId, jobId),
    ]);
    if (!job || job.state !== 'signed_off') return;
    const dueOn = recheckDueOn(signedOffAt, timeZone, recheckDays);
    const [reminder] = await db
      .insert(recheckReminders)
      .values({ shopId, jobId, dueOn })
      .onConflictDoNothing()
      .returning({ dueOn: recheckReminders.dueOn });
    if (reminder) await queueRecheckOrMarkFailed(shopId, jobId, dueOn, timeZone);
    if (!job.email) return;
    const [email] = await db
      .insert(customerReportEmails)
      .values({ shopId, jobId, toAddress: job.email })
      .onConflictDoNothing()
      .returning({ jobId: customerReportEmails.jobId });
    if (email) await queueReportEmailOrMarkFailed(shopId, jobId);
  } catch (error) {
    console.error('[follow-up] could not schedule the reminder or the customer e-mail', error);
  }
}

type MarkFailed = (reason: string) => Promise<unknown>;

async function guard(markFailed: MarkFailed, queue: () => Promise<unknown>) {
  try {
    await queue();
  } catch (error) {
    console.error('[follow-up] could not queue', error);
    await markFailed(`Could not be queued: ${failureReason(error)}`);
  }
}

const recheckFailed = (shopId: string, jobId: string) => (reason: string) =>
  getDb()
    .update(recheckReminders)
    .set({ status: 'failed', lastError: reason, updatedAt: new Date() })
    .where(and(eq(recheckReminders.shopId, shopId), eq(recheckReminders.jobId, jobId)));

const emailFailed = (shopId: string, jobId: string) => (reason: string) =>
  getDb()
    .update(customerReportEmails)
    .set({ status: 'failed', lastError: reason, updatedAt: new Date() })
    .where(and(eq(customerReportEmails.shopId, shopId), eq(customerReportEmails.jobId, jobId)));
