'use server';

import { memberAction } from '@/server/action';
import { practiceBatchSchema, startAttemptSchema } from '../schemas';
import { createAttempt } from '../server/attempts';
import { savePracticeBatch } from '../server/save-events';

/** Starts an attempt for the signed-in person; the page then opens its runner. */
export const startPracticeAttempt = memberAction(
  { permission: 'practice.run', schema: startAttemptSchema },
  async (input, member) => {
    const attempt = await createAttempt(member, input);
    return { id: attempt.id };
  },
);

/**
 * The runner's outbox in practice: the same batch and answer as a real wheel's save action,
 * keyed by the attempt (the outbox calls it `wheelId`, so practice and real wheels never share a
 * queue on the phone). Each event is stored once; nothing outside practice's tables is written.
 */
export const savePracticeEvents = memberAction(
  { permission: 'practice.run', schema: practiceBatchSchema },
  async ({ wheelId, events }, member) => savePracticeBatch(member, wheelId, events),
);
