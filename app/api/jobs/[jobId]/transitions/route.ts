import { z } from 'zod';
import { ids, transitionSchema } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { apiRoute } from '@/server/http/handler';

// Who may make which move is decided per job (assignee, lead, not own work) in the server layer.
export const POST = apiRoute({ permission: 'jobs.view', params: z.object({ jobId: ids.job }), body: transitionSchema }, async ({ member, params, body }) => ({
  data: await transitionJob(member, params.jobId, body.action, body.note, { wheels: body.wheels }),
}));
