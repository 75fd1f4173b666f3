import { z } from 'zod';
import { ids, wheelSchema } from '@/features/jobs/schemas';
import { addWheel, getJob } from '@/features/jobs/server/jobs';
import { checkbox } from '@/features/ui/form-data';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ jobId: ids.job });

export const GET = apiRoute({ permission: 'jobs.view', params }, async ({ member, params }) => ({
  data: (await getJob(member.shopId, params.jobId)).wheels,
}));

export const POST = apiRoute(
  {
    permission: 'jobs.edit',
    params,
    body: wheelSchema.extend({ acceptAxleMismatch: checkbox.default(false) }),
    status: 201,
  },
  async ({ member, params, body: { acceptAxleMismatch, ...wheel } }) => ({
    data: await addWheel(member, params.jobId, wheel, acceptAxleMismatch),
  }),
);
