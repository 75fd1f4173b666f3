import 'server-only';
import { and, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { reportLinks } from '@/db/schema';
import { env } from '@/server/env.mjs';
import { customerEmailBody } from '../customer-email-body';
import { getReportData } from './report-data';
import { createReportLink, reportLinkUrl } from './report-links';
import { assertReportReady, renderReport } from './render-report';

export type CustomerReportEmail = {
  to: string;
  subject: string;
  html: string;
  text: string;
  attachments: { filename: string; content: Buffer; contentType: string }[];
  /** The report link this e-mail carries, withdrawn by the sender if the e-mail does not go. */
  linkId: string;
};

/**
 * The customer's completion e-mail for a signed-off job: a fresh report link (made in the signer's
 * name), the words, and the PDF attached. Null when the customer has no address (the lead gives
 * them a link from the job page instead). Sends nothing: the queue's worker does.
 */
export async function composeCustomerReportEmail(
  shopId: string,
  jobId: string,
): Promise<CustomerReportEmail | null> {
  const data = await getReportData(shopId, jobId);
  const to = data.job.customer.email.trim();
  if (!to) return null;
  assertReportReady(data);
  const { pdf, filename, view } = await renderReport(shopId, data);
  const { id: linkId, token } = await createReportLink(shopId, jobId, data.signOff.byId);
  const body = customerEmailBody(view, reportLinkUrl(env().APP_URL, token));
  return {
    to,
    ...body,
    attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
    linkId,
  };
}

/**
 * Withdraws the link made for an e-mail that was not sent, so a failed attempt leaves no live
 * 90-day link that nobody received. By the system, so no lead is named as having revoked it.
 */
export async function withdrawUnsentReportLink(shopId: string, linkId: string): Promise<void> {
  await getDb()
    .update(reportLinks)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(reportLinks.shopId, shopId),
        eq(reportLinks.id, linkId),
        isNull(reportLinks.revokedAt),
      ),
    );
}
