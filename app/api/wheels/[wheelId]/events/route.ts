import { z } from 'zod';
import { ids } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { looseEventBatchSchema } from '@/features/runner/events';
import { saveWheelBatchForSession } from '@/features/runner/server/one-statement-save';
import { assertMayRun, listEvents, loadWheel, planFor } from '@/features/runner/server/run';
import { saveWheelBatch } from '@/features/runner/server/save-events';
import { reduceRun } from '@/features/runner/state';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ wheelId: ids.wheel });

/** The wheel's stored events and the state they add up to; the runner pulls it to converge with other devices. */
export const GET = apiRoute({ permission: 'jobs.run', params }, async ({ member, params }) => {
  const ctx = await loadWheel(member.shopId, params.wheelId);
  assertMayRun(member, ctx);
  const events = await listEvents(member.shopId, params.wheelId);
  return { data: { events, state: reduceRun(planFor(ctx), events) } };
});

/**
 * The runner's save path: a batch of confirmed events for one wheel, each stored once
 * (features/runner/server/save-events.ts). Each event is judged on its own: one the server will
 * never take comes back in `refused` with its place in the batch and is recorded for the lead's
 * review; the others are stored. The first event of an open or sent-back job starts it inside the
 * same transaction (the jobs feature's transition, composed here). A route handler rather than a
 * server action: its address survives deploys, and it costs the server less per confirmation.
 */
export const POST = apiRoute(
  {
    permission: 'jobs.run',
    params,
    body: looseEventBatchSchema,
    // A plain bolt confirmation: session, role, wheel, wrench and plan in one statement.
    quick: async ({ params, body, sessionId, permission }) => {
      const saved = await saveWheelBatchForSession(
        sessionId,
        permission,
        params.wheelId,
        body.events,
      );
      return saved && { data: saved };
    },
  },
  async ({ member, params, body }) => ({
    data: await saveWheelBatch(member, params.wheelId, body.events, (jobId, tx) =>
      transitionJob(member, jobId, 'start', '', { tx }),
    ),
  }),
);
