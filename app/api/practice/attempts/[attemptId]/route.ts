import { z } from 'zod';
import { attemptId } from '@/features/practice/schemas';
import { attemptFor, listPracticeEvents } from '@/features/practice/server/attempts';
import { apiRoute } from '@/server/http/handler';

/** One attempt: setup, events, and the score and result once finished. */
export const GET = apiRoute(
  { permission: 'practice.run', params: z.object({ attemptId }) },
  async ({ member, params }) => {
    const attempt = await attemptFor(member, params.attemptId);
    return { data: { ...attempt, events: await listPracticeEvents(member.shopId, attempt.id) } };
  },
);
