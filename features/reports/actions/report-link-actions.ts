'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { env } from '@/server/env.mjs';
import { createLinkSchema, revokeLinkSchema } from '../schemas';
import { createReportLink, reportLinkUrl, revokeReportLink } from '../server/report-links';

/** A new customer link for a signed-off job; its URL is in this answer only (the token is stored hashed). */
export const createCustomerLink = memberAction(
  { permission: 'reports.links', schema: createLinkSchema },
  async ({ jobId }, member) => {
    const link = await createReportLink(member.shopId, jobId, member.userId);
    revalidatePath(`/jobs/${jobId}`);
    return {
      id: link.id,
      url: reportLinkUrl(env().APP_URL, link.token),
      expiresAt: link.expiresAt.toISOString(),
    };
  },
);

export const revokeCustomerLink = memberAction(
  { permission: 'reports.links', schema: revokeLinkSchema },
  async ({ linkId }, member) => {
    const { jobId } = await revokeReportLink(member.shopId, linkId, member.userId);
    revalidatePath(`/jobs/${jobId}`);
    return { id: linkId };
  },
);
