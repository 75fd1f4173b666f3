import 'server-only';
import { and, eq, sql } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { getDb } from '@/db';
import { customerReportEmails, recheckReminders } from '@/db/schema';
import type { OutgoingMail } from '@/server/mail/mailer';
import { isLastAttempt, type JobAttempt } from '@/server/queue/jobs';
import { composeRecheckReminder } from './reminder-data';

/** How a handler sends mail: the mail module in the worker, a stand-in in tests. */
export type MailSender = (mail: OutgoingMail) => Promise<void>;

/** The customer's completion e-mail, made by the reports feature (null: no address). */
export type ReportEmail = {
  to: string;
  subject: string;
  html: string;
  text: string;
  attachments: { filename: string; content: Buffer; contentType: string }[];
  /** The customer link made for this attempt; withdrawn when the send fails. */
  linkId?: string;
};
export type ReportEmailComposer = (shopId: string, jobId: string) => Promise<ReportEmail | null>;
/** Withdraws the customer link an unsent e-mail carried (made by the reports feature). */
export type ReportLinkWithdrawer = (shopId: string, linkId: string) => Promise<void>;

/** Why a send failed, short enough for the job card. */
export const failureReason = (error: unknown) =>
  (error instanceof Error ? error.message : String(error)).replace(/\s+/g, ' ').slice(0, 300);

/**
 * Thrown after the row has recorded the failure: pg-boss retries the job with its backoff, or,
 * after the last attempt (the row now says `failed`), keeps it as failed.
 */
export class GiveUpOrRetry extends Error {}

/**
 * A delivery row's fields after one attempt: `sent`, or back to `waiting` with the reason
 * (`failed` after the last attempt). Both rows (reminder, customer e-mail) count attempts alike.
 */
function afterAttempt<W extends string>(
  attempts: AnyPgColumn,
  waiting: W,
  attempt: JobAttempt,
  error?: unknown,
) {
  const counted = { attempts: sql<number>`${attempts} + 1`, updatedAt: new Date() };
  if (error === undefined)
    return { ...counted, status: 'sent' as const, sentAt: new Date(), lastError: null };
  const status = isLastAttempt(attempt) ? ('failed' as const) : waiting;
  return { ...counted, status, lastError: failureReason(error) };
}

/**
 * The re-check reminder, once. The row is locked for the send: a second worker holding the same
 * job (or a duplicate job) waits, then finds it `sent` and does nothing. A row that was cancelled
 * or moved to another day (its job carries the old day) is left alone. A failed send stays
 * `scheduled` with its reason until the last attempt, which marks it `failed`; each failure is
 * thrown on to pg-boss, which counts the attempts.
 */
export async function deliverRecheckReminder(
  data: { shopId: string; jobId: string; dueOn: string },
  attempt: JobAttempt,
  send: MailSender,
): Promise<'sent' | 'skipped'> {
  const outcome = await getDb().transaction(async (tx) => {
    const where = and(
      eq(recheckReminders.shopId, data.shopId),
      eq(recheckReminders.jobId, data.jobId),
    );
    const [row] = await tx
      .select({ status: recheckReminders.status, dueOn: recheckReminders.dueOn })
      .from(recheckReminders)
      .where(where)
      .for('update');
    if (!row || row.status !== 'scheduled' || row.dueOn !== data.dueOn) return 'skipped' as const;
    try {
      const mail = await composeRecheckReminder(data.shopId, data.jobId, data.dueOn);
      if (!mail) throw new Error('Nobody to send it to: no customer address and no lead.');
      await send(mail);
    } catch (error) {
      await tx
        .update(recheckReminders)
        .set(afterAttempt(recheckReminders.attempts, 'scheduled', attempt, error))
        .where(where);
      return new GiveUpOrRetry(failureReason(error));
    }
    await tx
      .update(recheckReminders)
      .set(afterAttempt(recheckReminders.attempts, 'scheduled', attempt))
      .where(where);
    return 'sent' as const;
  });
  if (outcome instanceof GiveUpOrRetry) throw outcome;
  return outcome;
}

/**
 * The customer's completion e-mail, once per request: the same lock-then-check as the reminder,
 * on the row a sign-off or a lead's "Send again" set to `queued`.
 */
export async function deliverReportEmail(
  data: { shopId: string; jobId: string },
  attempt: JobAttempt,
  deps: { compose: ReportEmailComposer; send: MailSender; withdrawLink: ReportLinkWithdrawer },
): Promise<'sent' | 'skipped'> {
  const outcome = await getDb().transaction(async (tx) => {
    const where = and(
      eq(customerReportEmails.shopId, data.shopId),
      eq(customerReportEmails.jobId, data.jobId),
    );
    const [row] = await tx
      .select({ status: customerReportEmails.status })
      .from(customerReportEmails)
      .where(where)
      .for('update');
    if (!row || row.status !== 'queued') return 'skipped' as const;
    let to: string;
    let linkId: string | undefined;
    try {
      const mail = await deps.compose(data.shopId, data.jobId);
      if (!mail) throw new Error('The customer has no e-mail address.');
      ({ to, linkId } = mail);
      const { subject, html, text, attachments } = mail;
      await deps.send({ to, subject, html, text, attachments, shopId: data.shopId });
    } catch (error) {
      // Each attempt makes a fresh link; one nobody received must not stay open for 90 days.
      if (linkId)
        await deps
          .withdrawLink(data.shopId, linkId)
          .catch((e) => console.error('[follow-up] could not withdraw an unsent link', e));
      await tx
        .update(customerReportEmails)
        .set(afterAttempt(customerReportEmails.attempts, 'queued', attempt, error))
        .where(where);
      return new GiveUpOrRetry(failureReason(error));
    }
    await tx
      .update(customerReportEmails)
      .set({ ...afterAttempt(customerReportEmails.attempts, 'queued', attempt), toAddress: to })
      .where(where);
    return 'sent' as const;
  });
  if (outcome instanceof GiveUpOrRetry) throw outcome;
  return outcome;
}
