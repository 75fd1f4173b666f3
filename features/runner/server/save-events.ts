import 'server-only';
import { and, eq, inArray, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  jobWheels,
  refusedRunEvents,
  wheelRunEvents,
  wrenches,
  type WheelSnapshot,
} from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError } from '@/server/errors';
import { boltFlagReason, type ClientEvent, type EventRefusal } from '../events';
import { takeSnapshot } from '../snapshot';
import { prepareBatch, type SaveResult, type Timed } from './one-statement-save';
import { assertMayRun, flaggedSpecMessage, loadWheel } from './run';
import { wrenchRefusals } from './wrench-check';
import {
  UNSTORABLE,
  storableRaw,
  UUID,
  planRefusal,
  storedTurnedPasses,
  wheelPhotoIds,
  withoutForeignPhoto,
  stillTurning,
  reworkRefusal,
  withTarget,
} from './event-checks';

export type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];
/** Starts an open or sent-back job card inside the save's transaction (composed in app/ from the jobs feature). */
export type StartJob = (jobId: string, tx: Tx) => Promise<unknown>;
export type { SaveResult } from './one-statement-save';

/**
 * The runner's save path. Each event is judged alone; those that may be stored are stored in one
 * transaction, the others come back in `refused` (by their place in the batch) and are recorded
 * in `refused_run_events` for the lead's review — a refusal never discards the rest of a batch.
 * Stored times are clamped to the server's clock (the phone's own kept in `device_at`). The first
 * event of an open or sent-back job starts it, and the first event of a wheel takes its snapshot,
 * both inside the same transaction. The person is always the session's member, never the phone's say.
 */
export async function saveWheelBatch(
  member: Member,
  wheelId: string,
  raw: unknown[],
  startJob: StartJob,
  now = new Date(),
): Promise<SaveResult> {
  // The plain bolt confirmation was already tried in one statement by the route's quick try
  // (saveWheelBatchForSession); what reaches here is judged in full.
  const { parsed, events } = prepareBatch(raw, now);
  const indexOf = new Map(
    raw.map((e, i) => [(e as { clientId?: unknown })?.clientId, i] as const).reverse(),
  );
  return getDb().transaction(async (tx) => {
    const ctx = await loadWheel(member.shopId, wheelId, tx, true);
    assertMayRun(member, ctx);
    const refused: (EventRefusal & { raw: unknown })[] = parsed.refused.map((r) => ({
      ...r,
      raw: raw[r.index],
    }));
    const refuse = (e: Timed, r: Omit<EventRefusal, 'index' | 'clientId'>) =>
      refused.push({
        ...r,
        index: indexOf.get(e.clientId) ?? -1,
        clientId: e.clientId,
        raw: raw[indexOf.get(e.clientId) ?? -1] ?? e,
      });
    let accepted: Timed[] = [];
    let stored = 0;
    const closed = closedMessage(ctx);
    if (closed) {
      for (const e of events) refuse(e, { message: closed, fieldErrors: {} });
    } else if (events.length) {
      if (ctx.job.state !== 'in_progress') await startJob(ctx.job.id, tx);
      const snapshot = await ensureSnapshot(tx, member.shopId, ctx, now);
      const wrenchNo = await wrenchRefusals(tx, member.shopId, events, snapshot);
      const turnedPasses = await storedTurnedPasses(
        tx,
        member.shopId,
        wheelId,
        events,
        snapshot.plan.passes.length,
      );
      // In the batch's order, so a turned bolt opens the next check pass for the events after it.
      accepted = events.filter((e) => {
        const why =
          planRefusal(e, snapshot, turnedPasses) ??
          reworkRefusal(e, ctx.wheel.rework) ??
          wrenchNo.get(e.clientId) ??
          null;
        if (why) refuse(e, why);
        else if (e.type === 'bolt_confirmed' && e.payload.turned) turnedPasses.add(e.payload.pass);
        return !why;
      });
      const photos = await wheelPhotoIds(tx, member.shopId, wheelId, accepted);
      const fresh = await insertAccepted(
        tx,
        member,
        ctx,
        accepted.map((e) => withoutForeignPhoto(e, photos)),
        snapshot,
        refuse,
      );
      stored = fresh.size;
      await countWrenchCycles(
        tx,
        member.shopId,
        accepted.filter((e) => fresh.has(e.clientId)),
      );
      // A failed inspection, a flagged bolt or a bolt still turning on the last check pass stops the wheel for a lead (the first reason stays).
      const stop = accepted.find(
        (e) =>
          e.type === 'inspection_failed' || e.type === 'bolt_flagged' || stillTurning(e, snapshot),
      );
      const reason =
        stop?.type === 'inspection_failed'
          ? stop.payload.notes
          : stop?.type === 'bolt_flagged'
            ? boltFlagReason(stop.payload)
            : stop?.type === 'bolt_confirmed'
              ? `Bolt ${stop.payload.bolt} still turned on check pass ${stop.payload.pass}, the last one allowed.`
              : null;
      if (reason && !ctx.wheel.flaggedReason) {
        await tx
          .update(jobWheels)
          .set({ flaggedReason: reason })
          .where(and(eq(jobWheels.shopId, member.shopId), eq(jobWheels.id, wheelId)));
      }
    }
    if (refused.length) {
      // clientId: only a real uuid is kept, so junk ids cannot collide with or fill the index.
      await tx
        .insert(refusedRunEvents)
        .values(
          refused.map((r) => ({
            shopId: member.shopId,
            jobId: ctx.job.id,
            wheelId,
            clientId: r.clientId && UUID.test(r.clientId) ? r.clientId : null,
            byId: member.userId,
            reason: r.message.replace(UNSTORABLE, '\uFFFD'),
            raw: storableRaw(r.raw),
          })),
        )
        .onConflictDoNothing();
    }
    // Accepted ids not new now, nor refused as another wheel's: replays.
    const elsewhere = refused.filter((r) => r.message === ID_ELSEWHERE).length;
    return {
      saved: stored,
      duplicates: Math.max(0, new Set(accepted.map((e) => e.clientId)).size - stored - elsewhere),
      refused: refused
        .map((r) => ({
          index: r.index,
          clientId: r.clientId,
          message: r.message,
          fieldErrors: r.fieldErrors,
        }))
        .sort((a, b) => a.index - b.index),
    };
  });
}

const ID_ELSEWHERE = 'This event id was already used for another wheel.';

/** Why nothing more can be recorded on this wheel now, or null. A flagged spec refuses the whole batch. */
function closedMessage(ctx: Awaited<ReturnType<typeof loadWheel>>): string | null {
  const flagged = flaggedSpecMessage(ctx.spec);
  if (flagged) throw new DomainError('conflict', flagged);
  if (ctx.job.state === 'awaiting_signoff' || ctx.job.state === 'signed_off')
    return 'The job card was submitted for sign-off; its record is closed.';
  if (ctx.wheel.submittedAt) return 'This wheel was submitted; its record is closed.';
  return null;
}

/** The wheel's snapshot; taken (with its start time) on the first event, once, inside the transaction. */
async function ensureSnapshot(
  tx: Tx,
  shopId: string,
  ctx: Awaited<ReturnType<typeof loadWheel>>,
  now: Date,
): Promise<WheelSnapshot> {
  if (ctx.wheel.snapshot) return ctx.wheel.snapshot;
  const snapshot = takeSnapshot(ctx.spec, ctx.wheel, now);
  // The job's row is held, so no other save of this wheel is between the read and this write.
  await tx
    .update(jobWheels)
    .set({ snapshot, startedAt: now })
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.id, ctx.wheel.id)));
  return snapshot;
}

/** Inserts each accepted event once; an id another wheel already holds is refused, not claimed. */
async function insertAccepted(
  tx: Tx,
  member: Member,
  ctx: Awaited<ReturnType<typeof loadWheel>>,
  accepted: Timed[],
  snapshot: WheelSnapshot,
  refuse: (e: Timed, r: Omit<EventRefusal, 'index' | 'clientId'>) => void,
): Promise<Set<string>> {
  if (!accepted.length) return new Set();
  const rows = await tx
    .insert(wheelRunEvents)
    .values(
      accepted.map((e) => ({
        shopId: member.shopId,
        jobId: ctx.job.id,
        wheelId: ctx.wheel.id,
        clientId: e.clientId,
        type: e.type,
        payload: withTarget(e, snapshot) as Record<string, unknown>,
        byId: member.userId,
        clientAt: new Date(e.clientAt),
        deviceAt: e.deviceAt ? new Date(e.deviceAt) : null,
        deviceId: e.deviceId ?? null,
      })),
    )
    .onConflictDoNothing({ target: wheelRunEvents.clientId })
    .returning({ clientId: wheelRunEvents.clientId });
  if (rows.length < new Set(accepted.map((e) => e.clientId)).size) {
    const fresh = new Set(rows.map((r) => r.clientId));
    const mine = await tx
      .select({ clientId: wheelRunEvents.clientId })
      .from(wheelRunEvents)
      .where(
        and(
          eq(wheelRunEvents.shopId, member.shopId),
          eq(wheelRunEvents.wheelId, ctx.wheel.id),
          inArray(
            wheelRunEvents.clientId,
            accepted.filter((e) => !fresh.has(e.clientId)).map((e) => e.clientId),
          ),
        ),
      );
    const known = new Set(mine.map((r) => r.clientId));
    for (const e of accepted)
      if (!fresh.has(e.clientId) && !known.has(e.clientId))
        refuse(e, { message: ID_ELSEWHERE, fieldErrors: { clientId: ['Already used.'] } });
  }
  return new Set(rows.map((r) => r.clientId));
}

/**
 * Adds one cycle to each wrench per newly stored bolt confirmation naming it, so the 5,000-cycle
 * recalibration rule follows use without anyone typing a count. One statement for the batch.
 */
async function countWrenchCycles(tx: Tx, shopId: string, stored: readonly ClientEvent[]) {
  const perWrench = new Map<string, number>();
  for (const e of stored)
    if (e.type === 'bolt_confirmed' && e.payload.wrenchId)
      perWrench.set(e.payload.wrenchId, (perWrench.get(e.payload.wrenchId) ?? 0) + 1);
  if (!perWrench.size) return;
  const rows = [...perWrench].map(([id, n]) => sql`(${id}::uuid, ${n}::int)`);
  await tx.execute(sql`update ${wrenches} set cycles_since_calibration = coalesce(${wrenches}.cycles_since_calibration, 0) + c.n
    from (values ${sql.join(rows, sql`, `)}) as c (wrench_id, n)
    where ${wrenches}.id = c.wrench_id and ${wrenches}.shop_id = ${shopId}`);
}
