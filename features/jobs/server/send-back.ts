import 'server-only';
import { and, eq, inArray, sql } from 'drizzle-orm';
import type { getDb } from '@/db';
import { jobWheels, wheelRunEvents } from '@/db/schema';
import { DomainError } from '@/server/errors';
import type { SendBackWheel } from '../schemas';
import type { JobCard } from './jobs';

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

/**
 * The runner's event types that belong to each step (features/runner/events.ts): naming a step
 * supersedes exactly these events, so the runner asks for that step again and nothing else.
 */
const EVENT_TYPES_OF_STEP: Record<string, string[]> = {
  torque: ['bolt_confirmed', 'bolt_undone', 'wrench_chosen'],
  hand_start: ['hand_started', 'hand_unstarted'],
  inspect: ['inspection_failed'],
};

/** The wheels a send-back names, each checked to be on this job; none named = every wheel with the job's note. */
export function sendBackWheels(
  job: JobCard,
  note: string,
  wheels: SendBackWheel[] | undefined,
): SendBackWheel[] {
  if (!wheels?.length) return job.wheels.map((w) => ({ wheelId: w.id, note, steps: [] }));
  const ids = new Set(job.wheels.map((w) => w.id));
  const unknown = wheels.findIndex((w) => !ids.has(w.wheelId));
  if (unknown >= 0)
    throw new DomainError('invalid', 'Send back wheels of this job card only.', {
      [`wheels.${unknown}.wheelId`]: ['Not a wheel of this job card.'],
    });
  if (new Set(wheels.map((w) => w.wheelId)).size !== wheels.length)
    throw new DomainError('invalid', 'Name each wheel once.', {
      wheels: ['Name each wheel once.'],
    });
  return wheels;
}

/**
 * Reopens the named wheels inside the send-back's transaction: the submission is cleared, the
 * lead's note and steps are stored on the wheel for the runner, and the wheel's current events
 * (all of them, or those of the named steps) are marked superseded — kept in the history, no
 * longer read by the runner's reducer or the anomalies.
 */
export async function reopenWheels(
  tx: Tx,
  shopId: string,
  byId: string,
  wheels: SendBackWheel[],
  at: Date,
) {
  for (const w of wheels) {
    await tx
      .update(jobWheels)
      .set({
        submittedAt: null,
        submittedById: null,
        rework: { note: w.note, steps: w.steps, byId, at: at.toISOString() },
      })
      .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.id, w.wheelId)));
    const types = w.steps.flatMap((s) => EVENT_TYPES_OF_STEP[s] ?? []);
    const ofSteps = w.steps.length
      ? sql`and ((${inArray(wheelRunEvents.type, ['step_done', 'step_skipped'])} and ${inArray(sql`${wheelRunEvents.payload}->>'step'`, w.steps)})${types.length ? sql` or ${inArray(wheelRunEvents.type, types)}` : sql``})`
      : sql``;
    await tx.execute(sql`update ${wheelRunEvents} set superseded_at = ${at.toISOString()}::timestamptz
      where ${wheelRunEvents.shopId} = ${shopId} and ${wheelRunEvents.wheelId} = ${w.wheelId} and ${wheelRunEvents.supersededAt} is null ${ofSteps}`);
  }
}
