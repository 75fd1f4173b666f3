import { z } from 'zod';
import { ids, jobUpdateSchema } from '@/features/jobs/schemas';
import { getJob, updateJob } from '@/features/jobs/server/jobs';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ jobId: ids.job });

export const GET = apiRoute({ permission: 'jobs.view', params }, async ({ member, params }) => ({
  data: await getJob(member.shopId, params.jobId),
}));

export const PATCH = apiRoute(
  { permission: 'jobs.edit', params, body: jobUpdateSchema },
  async ({ member, params, body }) => ({
    data: await updateJob(member, params.jobId, body),
  }),
);
