import 'server-only';
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import {
  jobWheels,
  refusedRunEvents,
  wheelPhotos,
  wheelRunEvents,
  wrenches,
  type WheelSnapshot,
} from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError } from '@/server/errors';
import { boltFlagReason, type ClientEvent, type EventRefusal } from '../events';
import { maxPassIndex, plannedPassOf } from '../state';
import { takeSnapshot } from '../snapshot';
import {
  insertIfAllowed,
  knownMember,
  prepareBatch,
  type SaveResult,
  type Timed,
} from './one-statement-save';
import { assertMayRun, flaggedSpecMessage, loadWheel } from './run';
import { wrenchRefusals } from './wrench-check';

export type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];
/** Starts an open or sent-back job card inside the save's transaction (composed in app/ from the jobs feature). */
export type StartJob = (jobId: string, tx: Tx) => Promise<unknown>;
export type { SaveResult } from './one-statement-save';

// Lone UTF-16 halves and NUL cannot be stored in jsonb; the refusal keeps the rest of the event.
const UNSTORABLE = /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** The event as the phone sent it, made storable (bad characters replaced, at most 4 kB kept). */
function storableRaw(raw: unknown): unknown {
  try {
    const text = JSON.stringify(raw ?? null, (_key, value: unknown) =>
      typeof value === 'string' ? value.replace(UNSTORABLE, '\uFFFD') : value,
    );
    return text.length <= 4096 ? (JSON.parse(text) as unknown) : { truncated: text.slice(0, 4096) };
  } catch {
    return { unreadable: true };
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * A bolt or pass the wheel's snapshot does not have, or null. A check pass past the plan's (the
 * runner adds one each time a bolt turned on a check pass) is taken only when the pass before it
 * has a bolt confirmed as turned — stored on this wheel or earlier in the same batch (`turnedPasses`)
 * — and only up to MAX_CHECK_PASSES check passes in all.
 */
function planRefusal(
  e: ClientEvent,
  snapshot: WheelSnapshot,
  turnedPasses: ReadonlySet<number>,
): Omit<EventRefusal, 'index' | 'clientId'> | null {
  const bolt = 'bolt' in e.payload ? e.payload.bolt : undefined;
  const pass = 'pass' in e.payload ? e.payload.pass : undefined;
  const boltCount = snapshot.spec.boltCount;
  const planned = snapshot.plan.passes.length;
  if (bolt !== undefined && bolt > boltCount)
    return {
      message: `Bolt ${bolt} is not on this ${boltCount}-bolt ring.`,
      fieldErrors: { 'payload.bolt': ['No such bolt.'] },
    };
  if (pass !== undefined && pass > maxPassIndex(snapshot.plan.passes))
    return {
      message: `Pass ${pass} is not in this wheel's plan.`,
      fieldErrors: { 'payload.pass': ['No such pass.'] },
    };
  if (pass !== undefined && pass > planned && !turnedPasses.has(pass - 1)) {
    return {
      message: `Pass ${pass} is not in this wheel's plan.`,
      fieldErrors: {
        'payload.pass': [
          `A check pass is only added after a bolt turned on pass ${pass - 1}; none did.`,
        ],
      },
    };
  }
  return null;
}

/** The passes past the plan's check pass's predecessor on which a stored, current bolt confirmation says the bolt turned. */
async function storedTurnedPasses(
  tx: Tx,
  shopId: string,
  wheelId: string,
  events: readonly ClientEvent[],
  planned: number,
): Promise<Set<number>> {
  const wanted = [
    ...new Set(
      events.flatMap((e) =>
        'pass' in e.payload && e.payload.pass !== undefined && e.payload.pass > planned
          ? [e.payload.pass - 1]
          : [],
      ),
    ),
  ];
  if (!wanted.length) return new Set();
  const rows = await tx
    .selectDistinct({ pass: sql<number>`(${wheelRunEvents.payload}->>'pass')::int` })
    .from(wheelRunEvents)
    .where(
      and(
        eq(wheelRunEvents.shopId, shopId),
        eq(wheelRunEvents.wheelId, wheelId),
        eq(wheelRunEvents.type, 'bolt_confirmed'),
        isNull(wheelRunEvents.supersededAt),
        sql`${wheelRunEvents.payload}->'turned' = 'true'::jsonb`,
        inArray(sql`(${wheelRunEvents.payload}->>'pass')::int`, wanted),
      ),
    );
  return new Set(rows.map((r) => Number(r.pass)));
}

/** Which photo ids named by flagged bolts are photos of this wheel. */
async function wheelPhotoIds(
  tx: Tx,
  shopId: string,
  wheelId: string,
  events: readonly ClientEvent[],
): Promise<Set<string>> {
  const ids = events.flatMap((e) =>
    e.type === 'bolt_flagged' && e.payload.photoId ? [e.payload.photoId] : [],
  );
  if (!ids.length) return new Set();
  const rows = await tx
    .select({ id: wheelPhotos.id })
    .from(wheelPhotos)
    .where(
      and(
        eq(wheelPhotos.shopId, shopId),
        eq(wheelPhotos.wheelId, wheelId),
        inArray(wheelPhotos.id, ids),
      ),
    );
  return new Set(rows.map((r) => r.id));
}

/**
 * A flagged bolt is never refused over its photo (the stop matters more), but a photo id that is
 * not a photo of this wheel is not kept, so the record cannot point at another wheel's or shop's photo.
 */
function withoutForeignPhoto<E extends ClientEvent>(e: E, photos: ReadonlySet<string>): E {
  if (e.type !== 'bolt_flagged' || !e.payload.photoId || photos.has(e.payload.photoId)) return e;
  const payload = { ...e.payload };
  delete payload.photoId;
  return { ...e, payload };
}

/** A bolt that turned on the last check pass allowed: no pass follows, so the wheel goes to a lead. */
const stillTurning = (e: ClientEvent, snapshot: WheelSnapshot) =>
  e.type === 'bolt_confirmed' &&
  e.payload.turned === true &&
  snapshot.plan.passes.at(-1)?.kind === 'check' &&
  e.payload.pass === maxPassIndex(snapshot.plan.passes);

/** The runner step an event belongs to (the jobs feature's send-back supersedes by the same mapping). */
function stepOf(e: ClientEvent): string {
  if (e.type === 'step_done' || e.type === 'step_skipped') return e.payload.step;
  if (e.type === 'hand_started' || e.type === 'hand_unstarted') return 'hand_start';
  if (e.type === 'inspection_failed') return 'inspect';
  if (e.type === 'bolt_flagged') return e.payload.pass ? 'torque' : 'hand_start';
  return 'torque';
}

/** A wheel sent back for named steps takes rework for exactly those steps; null when this event may be stored. */
function reworkRefusal(
  e: ClientEvent,
  rework: { steps: string[] } | null,
): Omit<EventRefusal, 'index' | 'clientId'> | null {
  if (!rework?.steps.length || rework.steps.includes(stepOf(e))) return null;
  return {
    message: `This wheel was sent back to redo ${rework.steps.join(', ').replaceAll('_', ' ')} only; the rest of its record stands.`,
    fieldErrors: {},
  };
}

// An added check pass has the plan's check pass's target.
const withTarget = (e: ClientEvent, snapshot: WheelSnapshot) =>
  e.type === 'bolt_confirmed'
    ? { ...e.payload, target: plannedPassOf(snapshot.plan.passes, e.payload.pass)!.target }
    : e.payload;

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
  const { parsed, events, simple } = prepareBatch(raw, now);
  let fast = 0;
  if (simple) {
    fast = await insertIfAllowed(knownMember(member), wheelId, events);
    if (fast === events.length) return { saved: fast, duplicates: 0, refused: [] };
  }
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
    // Accepted ids neither new now nor in the fast path's insert, nor refused as another wheel's: replays.
    const elsewhere = refused.filter((r) => r.message === ID_ELSEWHERE).length;
    return {
      saved: stored + fast,
      duplicates: Math.max(
        0,
        new Set(accepted.map((e) => e.clientId)).size - stored - fast - elsewhere,
      ),
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
