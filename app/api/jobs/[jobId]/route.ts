import { z } from 'zod';
import { getFollowUp } from '@/features/follow-up/server/status';
import { ids, jobUpdateSchema } from '@/features/jobs/schemas';
import { getJob, updateJob } from '@/features/jobs/server/jobs';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ jobId: ids.job });

// With the customer follow-up after sign-off: `recheck: { dueOn, status } | null` and the
// customer e-mail's delivery (`customerEmail: { status, sentAt, lastError } | null`).
export const GET = apiRoute({ permission: 'jobs.view', params }, async ({ member, params }) => {
  const job = await getJob(member.shopId, params.jobId);
  const { recheck, customerEmail } = await getFollowUp(member.shopId, job.id);
  return {
    data: {
      ...job,
      recheck: recheck ? { dueOn: recheck.dueOn, status: recheck.status } : null,
      customerEmail: customerEmail
        ? {
            status: customerEmail.status,
            sentAt: customerEmail.sentAt,
            lastError: customerEmail.lastError,
          }
        : null,
    },
  };
});

export const PATCH = apiRoute(
  { permission: 'jobs.edit', params, body: jobUpdateSchema },
  async ({ member, params, body }) => ({
    data: await updateJob(member, params.jobId, body),
  }),
);
