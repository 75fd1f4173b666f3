import { attemptListQuery, startAttemptSchema } from '@/features/practice/schemas';
import { createAttempt, listAttemptsFor } from '@/features/practice/server/attempts';
import { apiRoute } from '@/server/http/handler';

/** The caller's attempts (a lead: the shop's, or one person's with `userId`). */
export const GET = apiRoute(
  { permission: 'practice.run', query: attemptListQuery },
  async ({ member, query }) => ({ data: await listAttemptsFor(member, query.userId) }),
);

/** Starts an attempt: `{ source: 'spec', specId, level }` or `{ source: 'surprise', level }`. */
export const POST = apiRoute(
  { permission: 'practice.run', body: startAttemptSchema, status: 201 },
  async ({ member, body }) => ({ data: await createAttempt(member, body) }),
);
