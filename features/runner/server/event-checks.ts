import 'server-only';
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { wheelPhotos, wheelRunEvents, type WheelSnapshot } from '@/db/schema';
import { type ClientEvent, type EventRefusal } from '../events';
import { maxPassIndex, plannedPassOf } from '../state';
import type { Tx } from './save-events';

/*
 * The save path's judgement of single events, apart from the transaction that stores them
 * (save-events.ts): what can be stored of a raw event, a bolt or pass the plan lacks, a check pass
 * that may follow, a photo of another wheel, a step outside a rework.
 */

// Lone UTF-16 halves and NUL cannot be stored in jsonb; the refusal keeps the rest of the event.
export const UNSTORABLE =
  /\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g;

/** The event as the phone sent it, made storable (bad characters replaced, at most 4 kB kept). */
export function storableRaw(raw: unknown): unknown {
  try {
    const text = JSON.stringify(raw ?? null, (_key, value: unknown) =>
      typeof value === 'string' ? value.replace(UNSTORABLE, '\uFFFD') : value,
    );
    return text.length <= 4096 ? (JSON.parse(text) as unknown) : { truncated: text.slice(0, 4096) };
  } catch {
    return { unreadable: true };
  }
}

export const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * A bolt or pass the wheel's snapshot does not have, or null. A check pass past the plan's (the
 * runner adds one each time a bolt turned on a check pass) is taken only when the pass before it
 * has a bolt confirmed as turned — stored on this wheel or earlier in the same batch (`turnedPasses`)
 * — and only up to MAX_CHECK_PASSES check passes in all.
 */
export function planRefusal(
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
export async function storedTurnedPasses(
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
export async function wheelPhotoIds(
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
export function withoutForeignPhoto<E extends ClientEvent>(e: E, photos: ReadonlySet<string>): E {
  if (e.type !== 'bolt_flagged' || !e.payload.photoId || photos.has(e.payload.photoId)) return e;
  const payload = { ...e.payload };
  delete payload.photoId;
  return { ...e, payload };
}

/** A bolt that turned on the last check pass allowed: no pass follows, so the wheel goes to a lead. */
export const stillTurning = (e: ClientEvent, snapshot: WheelSnapshot) =>
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
export function reworkRefusal(
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
export const withTarget = (e: ClientEvent, snapshot: WheelSnapshot) =>
  e.type === 'bolt_confirmed'
    ? { ...e.payload, target: plannedPassOf(snapshot.plan.passes, e.payload.pass)!.target }
    : e.payload;
