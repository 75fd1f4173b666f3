import 'server-only';
import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobs, jobWheels, wheelPhotos, wheelRunEvents, wheelSpecs } from '@/db/schema';
import { passPlan, tighteningSequence, type Pattern } from '@/features/torque-plan';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import type { ClientEvent, EventRefusal } from '../events';
import { reduceRun, submitBlockers, type RunnerPlan } from '../state';
import { stepsFor } from '../steps';

export type RunContext = Awaited<ReturnType<typeof loadWheel>>;

/** The wheel with its job and spec, in the member's shop only. */
export async function loadWheel(shopId: string, wheelId: string) {
  const [row] = await getDb()
    .select({ wheel: jobWheels, job: { id: jobs.id, number: jobs.number, state: jobs.state, assigneeId: jobs.assigneeId, dismount: jobs.dismount, reinstall: jobs.reinstall }, spec: wheelSpecs })
    .from(jobWheels)
    .innerJoin(jobs, eq(jobs.id, jobWheels.jobId))
    .innerJoin(wheelSpecs, eq(wheelSpecs.id, jobWheels.specId))
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.id, wheelId)));
  if (!row) throw notFound('That wheel');
  return row;
}

export function planFor(ctx: Pick<RunContext, 'spec' | 'job'>): RunnerPlan {
  const { spec } = ctx;
  const pattern: Pattern = spec.patternKind === 'skip' ? { kind: 'skip', step: spec.skipStep ?? 1 } : { kind: spec.patternKind };
  const staged = tighteningSequence(spec.boltCount, pattern);
  const check = tighteningSequence(spec.boltCount, { kind: 'sequential' });
  const passes = passPlan({ value: spec.finalTorque, unit: spec.torqueUnit }, spec.passFractions, { checkPass: spec.checkPass });
  return {
    steps: stepsFor(ctx.job),
    boltCount: spec.boltCount,
    passes: passes.map((p) => ({ index: p.index, kind: p.kind, order: p.kind === 'check' ? check : staged })),
  };
}

/** Why the runner will not run a wheel whose spec is flagged as implausible; null when it may run. */
export function flaggedSpecMessage(spec: Pick<RunContext['spec'], 'name' | 'plausibilityFlag'>): string | null {
  if (!spec.plausibilityFlag) return null;
  return `Stop: the spec "${spec.name}" is flagged and cannot be run until a lead corrects it. ${spec.plausibilityFlag}`;
}

/** Who may run this wheel: the assignee (technician or lead) or any lead; never an apprentice. */
export function assertMayRun(member: Member, ctx: Pick<RunContext, 'job'>) {
  if (!can(member.role, 'jobs.run')) throw new DomainError('forbidden', 'Your role does not allow running job cards.');
  if (member.role !== 'lead' && ctx.job.assigneeId !== member.userId) {
    throw new DomainError('forbidden', 'This job card is assigned to someone else. Ask a lead to assign it to you.');
  }
}

export async function listEvents(shopId: string, wheelId: string): Promise<ClientEvent[]> {
  const rows = await getDb()
    .select({ clientId: wheelRunEvents.clientId, clientAt: wheelRunEvents.clientAt, type: wheelRunEvents.type, payload: wheelRunEvents.payload })
    .from(wheelRunEvents)
    .where(and(eq(wheelRunEvents.shopId, shopId), eq(wheelRunEvents.wheelId, wheelId)))
    .orderBy(asc(wheelRunEvents.clientAt), asc(wheelRunEvents.clientId));
  return rows.map((r) => ({ ...r, clientAt: r.clientAt.toISOString() }) as ClientEvent);
}

/** The wheel's job is not in progress: the caller may start it (open, sent back) and try again. */
export class JobNotStartedError extends DomainError {
  constructor(readonly jobId: string, readonly state: string) {
    super('conflict', 'Start the job card before running its wheels.');
  }
}

const num = (payload: object, key: 'bolt' | 'pass') => (key in payload ? (payload as Record<string, number>)[key]! : null);

/**
 * The common case in one statement, without a transaction: insert the batch only if this member
 * may write to this wheel now (shop, in-progress job, assignee or lead, not submitted, spec not
 * flagged) and every
 * bolt and pass of the batch is on the wheel's plan — all or nothing. Answers how many rows were
 * new; fewer than the batch (a replay, a refusal) sends the caller to the explaining path.
 */
async function insertIfAllowed(member: Member, wheelId: string, events: ClientEvent[]): Promise<number> {
  const rows = events.map((e) => sql`(${e.clientId}::uuid, ${e.type}, ${JSON.stringify(e.payload)}::jsonb, ${e.clientAt}::timestamptz, ${num(e.payload, 'bolt')}::int, ${num(e.payload, 'pass')}::int)`);
  const inserted = await getDb().execute(sql`
    with ev (client_id, type, payload, client_at, bolt, pass) as (values ${sql.join(rows, sql`, `)}),
    w as (
      select w.id, w.job_id, s.bolt_count, jsonb_array_length(s.pass_fractions) + (case when s.check_pass then 1 else 0 end) as passes
      from ${jobWheels} w join ${jobs} j on j.id = w.job_id join ${wheelSpecs} s on s.id = w.spec_id
      where w.id = ${wheelId} and w.shop_id = ${member.shopId} and j.state = 'in_progress' and w.submitted_at is null
        and s.plausibility_flag is null
        and (${member.role} = 'lead' or j.assignee_id = ${member.userId})
    ),
    ok as (
      select ev.*, w.id as wheel_id, w.job_id from ev cross join w
      where (ev.bolt is null or ev.bolt <= w.bolt_count) and (ev.pass is null or ev.pass <= w.passes)
    )
    insert into ${wheelRunEvents} (shop_id, job_id, wheel_id, client_id, type, payload, by_id, client_at)
    select ${member.shopId}, ok.job_id, ok.wheel_id, ok.client_id, ok.type, ok.payload, ${member.userId}, ok.client_at
    from ok where (select count(*) from ok) = ${events.length}
    on conflict (client_id) do nothing
    returning client_id`);
  return inserted.length;
}

/** An event off this wheel's plan (a bolt or pass it does not have), refused by itself. */
type PlanRefusal = Omit<EventRefusal, 'index'> & { clientId: string };

/**
 * Stores confirmed events exactly once each (the device's id is unique), in any order, from any
 * device. The job must be in progress and the wheel not yet submitted. An event naming a bolt or
 * pass the wheel does not have is refused alone (in `refused`); the others are stored.
 */
export async function saveRunEvents(member: Member, wheelId: string, batch: ClientEvent[]): Promise<{ saved: number; duplicates: number; refused: PlanRefusal[] }> {
  const unique = new Set(batch.map((e) => e.clientId)).size;
  // Rows the fast path already stored when the batch mixed new events with a replay.
  let fast = 0;
  if (unique === batch.length && !batch.some((e) => e.type === 'inspection_failed')) {
    fast = await insertIfAllowed(member, wheelId, batch);
    if (fast === batch.length) return { saved: fast, duplicates: 0, refused: [] };
  }
  const ctx = await loadWheel(member.shopId, wheelId);
  assertMayRun(member, ctx);
  // Before the job-state check, so a wheel on a flagged spec does not start its job card either.
  const flagged = flaggedSpecMessage(ctx.spec);
  if (flagged) throw new DomainError('conflict', flagged);
  if (ctx.job.state !== 'in_progress') throw new JobNotStartedError(ctx.job.id, ctx.job.state);
  if (ctx.wheel.submittedAt) throw new DomainError('conflict', 'This wheel was submitted; its record is closed.');
  const plan = planFor(ctx);
  const refused: PlanRefusal[] = [];
  const events = batch.filter((e) => {
    const bolt = 'bolt' in e.payload ? e.payload.bolt : undefined;
    const pass = 'pass' in e.payload ? e.payload.pass : undefined;
    if (bolt !== undefined && bolt > plan.boltCount) refused.push({ clientId: e.clientId, message: `Bolt ${bolt} is not on this ${plan.boltCount}-bolt ring.`, fieldErrors: { 'payload.bolt': ['No such bolt.'] } });
    else if (pass !== undefined && pass > plan.passes.length) refused.push({ clientId: e.clientId, message: `Pass ${pass} is not in this wheel's plan.`, fieldErrors: { 'payload.pass': ['No such pass.'] } });
    else return true;
    return false;
  });
  if (events.length === 0) return { saved: fast, duplicates: 0, refused };
  const kept = new Set(events.map((e) => e.clientId)).size;
  const db = getDb();
  const stored = await db
    .insert(wheelRunEvents)
    .values(events.map((e) => ({ shopId: member.shopId, jobId: ctx.job.id, wheelId, clientId: e.clientId, type: e.type, payload: e.payload as Record<string, unknown>, byId: member.userId, clientAt: new Date(e.clientAt) })))
    .onConflictDoNothing({ target: wheelRunEvents.clientId })
    .returning({ clientId: wheelRunEvents.clientId });
  if (stored.length < kept) {
    // Replays are fine; an id already stored for another wheel or shop is not this request's to claim.
    const known = await db
      .select({ clientId: wheelRunEvents.clientId })
      .from(wheelRunEvents)
      .where(and(eq(wheelRunEvents.wheelId, wheelId), eq(wheelRunEvents.shopId, member.shopId), inArray(wheelRunEvents.clientId, events.map((e) => e.clientId))));
    if (known.length !== kept) throw new DomainError('conflict', 'An event id was already used elsewhere.');
  }
  const failed = events.find((e) => e.type === 'inspection_failed');
  if (failed && !ctx.wheel.flaggedReason) {
    await db.update(jobWheels).set({ flaggedReason: failed.payload.notes }).where(and(eq(jobWheels.shopId, member.shopId), eq(jobWheels.id, wheelId)));
  }
  return { saved: stored.length + fast, duplicates: events.length - stored.length - fast, refused };
}

/** Closes the wheel's record when nothing blocks it; answers whether every wheel of the job is in. */
export async function submitWheel(member: Member, wheelId: string) {
  const ctx = await loadWheel(member.shopId, wheelId);
  assertMayRun(member, ctx);
  if (ctx.wheel.submittedAt) return { jobId: ctx.job.id, allSubmitted: await allSubmitted(member.shopId, ctx.job.id) };
  if (ctx.job.state !== 'in_progress') throw new DomainError('conflict', 'Start the job card before submitting its wheels.');
  const plan = planFor(ctx);
  const state = reduceRun(plan, await listEvents(member.shopId, wheelId));
  const photos = await getDb().select({ kind: wheelPhotos.kind }).from(wheelPhotos).where(and(eq(wheelPhotos.shopId, member.shopId), eq(wheelPhotos.wheelId, wheelId)));
  const blockers = submitBlockers(plan, state, photos.map((p) => p.kind));
  if (blockers.length) throw new DomainError('conflict', blockers.join(' '), { submit: blockers });
  await getDb().update(jobWheels).set({ submittedAt: new Date(), submittedById: member.userId }).where(and(eq(jobWheels.shopId, member.shopId), eq(jobWheels.id, wheelId), isNull(jobWheels.submittedAt)));
  return { jobId: ctx.job.id, allSubmitted: await allSubmitted(member.shopId, ctx.job.id) };
}

async function allSubmitted(shopId: string, jobId: string) {
  const wheels = await getDb().select({ submittedAt: jobWheels.submittedAt }).from(jobWheels).where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  return wheels.every((w) => w.submittedAt);
}

