'use server';

import { ids } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { looseEventBatchSchema } from '@/features/runner/events';
import { saveWheelBatchForSession } from '@/features/runner/server/one-statement-save';
import { saveWheelBatch } from '@/features/runner/server/save-events';
import { memberAction } from '@/server/action';

/**
 * The runner's save path: a batch of confirmed events for one wheel, each stored once, in one
 * transaction (features/runner/server/save-events.ts). Each event is judged on its own: one the
 * server will never take comes back in `refused` with its place in the batch and is recorded for
 * the lead's review; the others are stored. The first event of an open or sent-back job starts it
 * inside the same transaction (the jobs feature's transition, composed here). A device that
 * queued events before a deploy calls the new build's action id after its reload.
 */
export const saveWheelEvents = memberAction(
  {
    permission: 'jobs.run',
    schema: looseEventBatchSchema.extend({ wheelId: ids.wheel }),
    // A plain bolt confirmation: session, role, wheel, wrench and plan in one statement.
    quick: ({ wheelId, events }, sessionId) => saveWheelBatchForSession(sessionId, wheelId, events),
  },
  async ({ wheelId, events }, member) =>
    saveWheelBatch(member, wheelId, events, (jobId, tx) =>
      transitionJob(member, jobId, 'start', '', { tx }),
    ),
);
