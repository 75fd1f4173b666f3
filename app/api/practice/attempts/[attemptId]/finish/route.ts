import { z } from 'zod';
import { attemptId } from '@/features/practice/schemas';
import { finishAttempt } from '@/features/practice/server/finish';
import { apiRoute } from '@/server/http/handler';

/** Scores the attempt once; finishing again returns the same result. */
export const POST = apiRoute(
  { permission: 'practice.run', params: z.object({ attemptId }) },
  async ({ member, params }) => ({ data: await finishAttempt(member, params.attemptId) }),
);
