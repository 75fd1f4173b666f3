'use server';

import { memberAction } from '@/server/action';
import { startAttemptSchema } from '../schemas';
import { createAttempt } from '../server/attempts';

/** Starts an attempt for the signed-in person; the page then opens its runner. */
export const startPracticeAttempt = memberAction(
  { permission: 'practice.run', schema: startAttemptSchema },
  async (input, member) => {
    const attempt = await createAttempt(member, input);
    return { id: attempt.id };
  },
);
