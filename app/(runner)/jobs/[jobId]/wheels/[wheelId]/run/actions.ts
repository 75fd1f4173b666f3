'use server';

import { ids } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { eventBatchSchema } from '@/features/runner/events';
import { JobNotStartedError, saveRunEvents } from '@/features/runner/server/run';
import { memberAction } from '@/server/action';

/**
 * The runner's save path: a batch of confirmed events for one wheel, each stored once. The first
 * event of an open or sent-back job starts it. A device that queued events before a deploy calls
 * the new build's action id after its reload (see the runner's outbox).
 */
export const saveWheelEvents = memberAction({ permission: 'jobs.run', schema: eventBatchSchema.extend({ wheelId: ids.wheel }) }, async ({ wheelId, events }, member) => {
  try {
    return await saveRunEvents(member, wheelId, events);
  } catch (error) {
    if (!(error instanceof JobNotStartedError) || (error.state !== 'open' && error.state !== 'sent_back')) throw error;
    await transitionJob(member, error.jobId, 'start', '');
    return await saveRunEvents(member, wheelId, events);
  }
});
