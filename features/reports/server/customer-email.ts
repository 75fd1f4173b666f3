import 'server-only';
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
  const { token } = await createReportLink(shopId, jobId, data.signOff.byId);
  const body = customerEmailBody(view, reportLinkUrl(env().APP_URL, token));
  return {
    to,
    ...body,
    attachments: [{ filename, content: pdf, contentType: 'application/pdf' }],
  };
}
