import { z } from 'zod';
import { ids } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { eventBatchSchema } from '@/features/runner/events';
import { assertMayRun, JobNotStartedError, listEvents, loadWheel, planFor, saveRunEvents } from '@/features/runner/server/run';
import { reduceRun } from '@/features/runner/state';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ wheelId: ids.wheel });

export const GET = apiRoute({ permission: 'jobs.run', params }, async ({ member, params }) => {
  const ctx = await loadWheel(member.shopId, params.wheelId);
  assertMayRun(member, ctx);
  const events = await listEvents(member.shopId, params.wheelId);
  return { data: { events, state: reduceRun(planFor(ctx), events) } };
});

/**
 * The runner's save path: a stable URL (server action ids change with every build, and a phone
 * may hold queued confirmations across a deploy). The first event of an open or sent-back job
 * starts it.
 */
export const POST = apiRoute({ permission: 'jobs.run', params, body: eventBatchSchema }, async ({ member, params, body }) => {
  try {
    return { data: await saveRunEvents(member, params.wheelId, body.events) };
  } catch (error) {
    if (!(error instanceof JobNotStartedError) || (error.state !== 'open' && error.state !== 'sent_back')) throw error;
    await transitionJob(member, error.jobId, 'start', '');
    return { data: await saveRunEvents(member, params.wheelId, body.events) };
  }
});
