import { z } from 'zod';
import { attemptId, practiceBatchSchema } from '@/features/practice/schemas';
import { attemptFor, listPracticeEvents } from '@/features/practice/server/attempts';
import { savePracticeBatch } from '@/features/practice/server/save-events';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ attemptId });

/** The attempt's stored events (the runner pulls them to converge with another tab or phone). */
export const GET = apiRoute({ permission: 'practice.run', params }, async ({ member, params }) => {
  const attempt = await attemptFor(member, params.attemptId);
  return { data: { events: await listPracticeEvents(member.shopId, attempt.id) } };
});

/** `{ events }` in the runner's shape: each id stored once, refusals per event. */
export const POST = apiRoute(
  { permission: 'practice.run', params, body: practiceBatchSchema.omit({ wheelId: true }) },
  async ({ member, params, body }) => ({
    data: await savePracticeBatch(member, params.attemptId, body.events),
  }),
);
