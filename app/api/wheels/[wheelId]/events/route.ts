import { z } from 'zod';
import { ids } from '@/features/jobs/schemas';
import { assertMayRun, listEvents, loadWheel, planFor } from '@/features/runner/server/run';
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
