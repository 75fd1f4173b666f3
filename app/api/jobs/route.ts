import { boardQuerySchema, jobSchema } from '@/features/jobs/schemas';
import { listBoard } from '@/features/jobs/server/board';
import { createJob, getJob } from '@/features/jobs/server/jobs';
import { apiRoute } from '@/server/http/handler';

export const GET = apiRoute(
  { permission: 'jobs.view', query: boardQuerySchema },
  ({ member, query }) => listBoard(member, query),
);

export const POST = apiRoute(
  { permission: 'jobs.create', body: jobSchema, status: 201 },
  async ({ member, body }) => {
    const { id } = await createJob(member, body);
    return { data: await getJob(member.shopId, id) };
  },
);
