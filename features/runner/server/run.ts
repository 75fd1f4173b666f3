import 'server-only';
import { and, asc, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  jobs,
  jobWheels,
  wheelPhotos,
  wheelRunEvents,
  wheelSpecs,
  type WheelSnapshot,
} from '@/db/schema';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import type { ClientEvent } from '../events';
import { planFromSnapshot, takeSnapshot } from '../snapshot';
import { reduceRun, submitBlockers, type RunnerPlan } from '../state';

export type RunContext = Awaited<ReturnType<typeof loadWheel>>;
type Db = Pick<ReturnType<typeof getDb>, 'select'>;

const wheelSelection = {
  wheel: jobWheels,
  job: {
    id: jobs.id,
    number: jobs.number,
    state: jobs.state,
    assigneeId: jobs.assigneeId,
    dismount: jobs.dismount,
    reinstall: jobs.reinstall,
  },
  spec: wheelSpecs,
};

/**
 * The wheel with its job and spec, in the member's shop only. With `lock` (inside the save
 * path's transaction) the job's row is held until it commits, so a transition waits for it.
 */
export async function loadWheel(shopId: string, wheelId: string, db: Db = getDb(), lock = false) {
  const query = db
    .select(wheelSelection)
    .from(jobWheels)
    .innerJoin(jobs, eq(jobs.id, jobWheels.jobId))
    .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.id, wheelId)));
  const [row] = lock ? await query.for('update', { of: jobs }) : await query;
  if (!row) throw notFound('That wheel');
  return row;
}

/**
 * The wheel's snapshot once its run started (stored with the first event); before that, what it
 * would be if it started now. Everything the runner shows and checks comes from here, so a spec
 * edited later never changes a wheel already run.
 */
export function snapshotOf(
  ctx: Pick<RunContext, 'spec' | 'wheel'>,
  now = new Date(),
): WheelSnapshot {
  return ctx.wheel.snapshot ?? takeSnapshot(ctx.spec, ctx.wheel, now);
}

export function planFor(ctx: Pick<RunContext, 'spec' | 'job' | 'wheel'>): RunnerPlan {
  return planFromSnapshot(snapshotOf(ctx), ctx.job);
}

/** Why the runner will not run a wheel whose spec is flagged as implausible; null when it may run. */
export function flaggedSpecMessage(
  spec: Pick<RunContext['spec'], 'name' | 'plausibilityFlag'>,
): string | null {
  if (!spec.plausibilityFlag) return null;
  return `Stop: the spec "${spec.name}" is flagged and cannot be run until a lead corrects it. ${spec.plausibilityFlag}`;
}

/**
 * Who may run this wheel: the assignee (technician, or an apprentice a lead has cleared for real
 * wheels) or any lead. A revoked clearance stops the apprentice's next request, assigned or not.
 */
export function assertMayRun(member: Member, ctx: { job: Pick<RunContext['job'], 'assigneeId'> }) {
  if (member.role === 'apprentice' && !can(member, 'jobs.run'))
    throw new DomainError(
      'forbidden',
      'You are not yet cleared for real wheels — a lead clears you on Practice progress.',
    );
  if (!can(member, 'jobs.run'))
    throw new DomainError('forbidden', 'Your role does not allow running job cards.');
  if (member.role !== 'lead' && ctx.job.assigneeId !== member.userId) {
    throw new DomainError(
      'forbidden',
      'This job card is assigned to someone else. Ask a lead to assign it to you.',
    );
  }
}

export async function listEvents(shopId: string, wheelId: string): Promise<ClientEvent[]> {
  const rows = await getDb()
    .select({
      clientId: wheelRunEvents.clientId,
      clientAt: wheelRunEvents.clientAt,
      type: wheelRunEvents.type,
      payload: wheelRunEvents.payload,
      deviceId: wheelRunEvents.deviceId,
    })
    .from(wheelRunEvents)
    // Events a send-back superseded stay in the history but no longer count.
    .where(
      and(
        eq(wheelRunEvents.shopId, shopId),
        eq(wheelRunEvents.wheelId, wheelId),
        isNull(wheelRunEvents.supersededAt),
      ),
    )
    .orderBy(asc(wheelRunEvents.clientAt), asc(wheelRunEvents.clientId));
  // An event from before phones kept an id has none (not null), as the event schema reads it.
  return rows.map(
    ({ deviceId, ...r }) =>
      ({
        ...r,
        clientAt: r.clientAt.toISOString(),
        ...(deviceId ? { deviceId } : {}),
      }) as ClientEvent,
  );
}

/** Closes the wheel's record when nothing blocks it; answers whether every wheel of the job is in. */
export async function submitWheel(member: Member, wheelId: string) {
  const ctx = await loadWheel(member.shopId, wheelId);
  assertMayRun(member, ctx);
  if (ctx.wheel.submittedAt)
    return { jobId: ctx.job.id, allSubmitted: await allSubmitted(member.shopId, ctx.job.id) };
  if (ctx.job.state !== 'in_progress')
    throw new DomainError('conflict', 'Start the job card before submitting its wheels.');
  const plan = planFor(ctx);
  const state = reduceRun(plan, await listEvents(member.shopId, wheelId));
  const photos = await getDb()
    .select({ kind: wheelPhotos.kind })
    .from(wheelPhotos)
    .where(and(eq(wheelPhotos.shopId, member.shopId), eq(wheelPhotos.wheelId, wheelId)));
  const blockers = submitBlockers(
    plan,
    state,
    photos.map((p) => p.kind),
  );
  if (blockers.length) throw new DomainError('conflict', blockers.join(' '), { submit: blockers });
  await getDb()
    .update(jobWheels)
    .set({ submittedAt: new Date(), submittedById: member.userId })
    .where(
      and(
        eq(jobWheels.shopId, member.shopId),
        eq(jobWheels.id, wheelId),
        isNull(jobWheels.submittedAt),
      ),
    );
  return { jobId: ctx.job.id, allSubmitted: await allSubmitted(member.shopId, ctx.job.id) };
}

async function allSubmitted(shopId: string, jobId: string) {
  const wheels = await getDb()
    .select({ submittedAt: jobWheels.submittedAt })
    .from(jobWheels)
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  return wheels.every((w) => w.submittedAt);
}
