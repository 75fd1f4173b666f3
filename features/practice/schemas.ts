import { z } from 'zod';
import { looseEventBatchSchema } from '@/features/runner/events';
import { PRACTICE_LEVELS } from './types';

export const attemptId = z.uuid({ error: 'Unknown attempt.' });

/** Starting an attempt: from one of the shop's specs, or a random ring ("surprise me"). */
export const startAttemptSchema = z.discriminatedUnion(
  'source',
  [
    z.object({
      source: z.literal('spec'),
      specId: z.uuid({ error: 'Choose one of the shop’s specs.' }),
      level: z.enum(PRACTICE_LEVELS, { error: 'Choose a level.' }),
    }),
    z.object({
      source: z.literal('surprise'),
      level: z.enum(PRACTICE_LEVELS, { error: 'Choose a level.' }),
    }),
  ],
  { error: 'Choose a spec or “Surprise me”.' },
);
export type StartAttemptInput = z.infer<typeof startAttemptSchema>;

/** The runner's batch shape, keyed by the attempt (the runner's outbox calls it `wheelId`). */
export const practiceBatchSchema = looseEventBatchSchema.extend({ wheelId: attemptId });

export const attemptListQuery = z.object({
  userId: z.uuid({ error: 'Unknown person.' }).optional(),
});
