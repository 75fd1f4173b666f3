import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { customerReportEmails, recheckReminders } from '@/db/schema';

export type RecheckStatus = {
  dueOn: string;
  status: 'scheduled' | 'sent' | 'failed' | 'cancelled';
  lastError: string | null;
  sentAt: string | null;
};
export type CustomerEmailStatus = {
  to: string;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  sentAt: string | null;
};
export type FollowUp = { recheck: RecheckStatus | null; customerEmail: CustomerEmailStatus | null };

/** The reminder and the customer e-mail of one job, as the job card and its API show them. */
export async function getFollowUp(shopId: string, jobId: string): Promise<FollowUp> {
  const db = getDb();
  const [[recheck], [email]] = await Promise.all([
    db
      .select({
        dueOn: recheckReminders.dueOn,
        status: recheckReminders.status,
        lastError: recheckReminders.lastError,
        sentAt: recheckReminders.sentAt,
      })
      .from(recheckReminders)
      .where(and(eq(recheckReminders.shopId, shopId), eq(recheckReminders.jobId, jobId))),
    db
      .select({
        to: customerReportEmails.toAddress,
        status: customerReportEmails.status,
        attempts: customerReportEmails.attempts,
        lastError: customerReportEmails.lastError,
        sentAt: customerReportEmails.sentAt,
      })
      .from(customerReportEmails)
      .where(and(eq(customerReportEmails.shopId, shopId), eq(customerReportEmails.jobId, jobId))),
  ]);
  return {
    recheck: recheck ? { ...recheck, sentAt: recheck.sentAt?.toISOString() ?? null } : null,
    customerEmail: email ? { ...email, sentAt: email.sentAt?.toISOString() ?? null } : null,
  };
}
