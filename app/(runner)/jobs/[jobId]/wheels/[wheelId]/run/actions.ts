'use server';

import { ids } from '@/features/jobs/schemas';
import { transitionJob } from '@/features/jobs/server/transitions';
import { looseEventBatchSchema, partitionEvents, type ClientEvent, type EventRefusal } from '@/features/runner/events';
import { JobNotStartedError, saveRunEvents } from '@/features/runner/server/run';
import { memberAction } from '@/server/action';
import type { Member } from '@/server/auth/session';

async function save(member: Member, wheelId: string, events: ClientEvent[]) {
  try {
    return await saveRunEvents(member, wheelId, events);
  } catch (error) {
    if (!(error instanceof JobNotStartedError) || (error.state !== 'open' && error.state !== 'sent_back')) throw error;
    await transitionJob(member, error.jobId, 'start', '');
    return await saveRunEvents(member, wheelId, events);
  }
}

/**
 * The runner's save path: a batch of confirmed events for one wheel, each stored once. The first
 * event of an open or sent-back job starts it. Each event is judged on its own: one the server
 * will never take (bad data, a bolt the ring does not have) comes back in `refused` with its
 * place in the batch and its field errors, and the others are stored, so the phone sets aside
 * only that one. A device that queued events before a deploy calls the new build's action id
 * after its reload (see the runner's outbox).
 */
export const saveWheelEvents = memberAction({ permission: 'jobs.run', schema: looseEventBatchSchema.extend({ wheelId: ids.wheel }) }, async ({ wheelId, events: raw }, member) => {
  const { events, refused } = partitionEvents(raw);
  const result = events.length ? await save(member, wheelId, events) : { saved: 0, duplicates: 0, refused: [] };
  const indexOf = new Map(raw.map((e, i) => [(e as { clientId?: unknown })?.clientId, i] as const).reverse());
  const offPlan: EventRefusal[] = result.refused.map((r) => ({ ...r, index: indexOf.get(r.clientId) ?? -1 }));
  return { saved: result.saved, duplicates: result.duplicates, refused: [...refused, ...offPlan].sort((a, b) => a.index - b.index) };
});
