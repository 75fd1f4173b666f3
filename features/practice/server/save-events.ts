import 'server-only';
import { and, eq, inArray } from 'drizzle-orm';
import { getDb } from '@/db';
import { practiceAttempts, practiceEvents } from '@/db/schema';
import { clampClientAt } from '@/features/runner/clock-window';
import { partitionEvents, type ClientEvent, type EventRefusal } from '@/features/runner/events';
import { maxPassIndex, plannedPassOf } from '@/features/runner/state';
import type { Member } from '@/server/auth/session';
import { notFound } from '@/server/errors';
import type { PracticeSetup } from '../types';

export type PracticeSaveResult = { saved: number; duplicates: number; refused: EventRefusal[] };
type Why = Omit<EventRefusal, 'index' | 'clientId'>;

function timesOf(clientAt: string, now: Date) {
  const t = clampClientAt(clientAt, now);
  return { clientAt: new Date(t.clientAt), deviceAt: t.deviceAt ? new Date(t.deviceAt) : null };
}

/** A bolt, pass or wrench the attempt's setup does not have, or null. */
function setupRefusal(e: ClientEvent, setup: PracticeSetup): Why | null {
  const boltCount = setup.snapshot.spec.boltCount;
  if ('bolt' in e.payload && e.payload.bolt > boltCount)
    return {
      message: `Bolt ${e.payload.bolt} is not on this ${boltCount}-bolt ring.`,
      fieldErrors: { 'payload.bolt': ['No such bolt.'] },
    };
  const pass = 'pass' in e.payload ? e.payload.pass : undefined;
  if (pass !== undefined && pass > maxPassIndex(setup.snapshot.plan.passes))
    return {
      message: `Pass ${pass} is not in this attempt's plan.`,
      fieldErrors: { 'payload.pass': ['No such pass.'] },
    };
  const wrenchId = 'wrenchId' in e.payload ? e.payload.wrenchId : undefined;
  if (wrenchId && !setup.wrenches.some((w) => w.id === wrenchId))
    return {
      message: 'That wrench is not on offer in this attempt.',
      fieldErrors: { 'payload.wrenchId': ['Pick one of the wrenches on offer.'] },
    };
  return null;
}

// A confirmed bolt carries its pass's target, as on a real wheel, so the score reads the event alone.
const withTarget = (e: ClientEvent, setup: PracticeSetup) =>
  e.type === 'bolt_confirmed'
    ? { ...e.payload, target: plannedPassOf(setup.snapshot.plan.passes, e.payload.pass)!.target }
    : e.payload;

/**
 * Practice's save path, the runner's pattern kept simple: each event judged alone (a refusal never
 * holds up the rest), each client id stored once (`on conflict do nothing`, so a replay after a
 * dropped answer is harmless), times clamped to the server's clock with the phone's own kept.
 * Only the attempt's own person writes to it, and only until it is finished. Writes only
 * `practice_events`.
 */
export async function savePracticeBatch(
  member: Member,
  attemptId: string,
  raw: unknown[],
  now = new Date(),
): Promise<PracticeSaveResult> {
  const parsed = partitionEvents(raw);
  const placeOf = (e: ClientEvent) =>
    raw.findIndex((r) => (r as { clientId?: unknown } | null)?.clientId === e.clientId);
  return getDb().transaction(async (tx) => {
    // Held until commit, so a finish waits for this batch and a batch after a finish is refused.
    const [attempt] = await tx
      .select({
        userId: practiceAttempts.userId,
        setup: practiceAttempts.setup,
        finishedAt: practiceAttempts.finishedAt,
      })
      .from(practiceAttempts)
      .where(and(eq(practiceAttempts.shopId, member.shopId), eq(practiceAttempts.id, attemptId)))
      .for('update');
    if (!attempt || attempt.userId !== member.userId) throw notFound('That attempt');
    const setup = attempt.setup as PracticeSetup;
    const refused: EventRefusal[] = [...parsed.refused];
    const refuse = (e: ClientEvent, why: Why) =>
      refused.push({ ...why, index: placeOf(e), clientId: e.clientId });
    const accepted = parsed.events.filter((e) => {
      const why = attempt.finishedAt
        ? { message: 'This attempt is finished; its record is closed.', fieldErrors: {} }
        : setupRefusal(e, setup);
      if (why) refuse(e, why);
      return !why;
    });
    let saved = 0;
    if (accepted.length) {
      const rows = await tx
        .insert(practiceEvents)
        .values(
          accepted.map((e) => ({
            shopId: member.shopId,
            attemptId,
            clientId: e.clientId,
            type: e.type,
            payload: withTarget(e, setup) as Record<string, unknown>,
            byId: member.userId,
            ...timesOf(e.clientAt, now),
            deviceId: e.deviceId ?? null,
          })),
        )
        .onConflictDoNothing({ target: practiceEvents.clientId })
        .returning({ clientId: practiceEvents.clientId });
      saved = rows.length;
      const fresh = new Set(rows.map((r) => r.clientId));
      const others = accepted.filter((e) => !fresh.has(e.clientId));
      if (others.length) {
        // Not new: a replay of this attempt's own event, or an id another attempt holds (refused).
        const mine = await tx
          .select({ clientId: practiceEvents.clientId })
          .from(practiceEvents)
          .where(
            and(
              eq(practiceEvents.attemptId, attemptId),
              inArray(
                practiceEvents.clientId,
                others.map((e) => e.clientId),
              ),
            ),
          );
        const held = new Set(mine.map((r) => r.clientId));
        for (const e of others)
          if (!held.has(e.clientId))
            refuse(e, { message: 'This event id was already used elsewhere.', fieldErrors: {} });
      }
    }
    const duplicates = new Set(accepted.map((e) => e.clientId)).size - saved;
    const elsewhere = refused.filter((r) => r.message.endsWith('used elsewhere.')).length;
    return {
      saved,
      duplicates: Math.max(0, duplicates - elsewhere),
      refused: refused.sort((a, b) => a.index - b.index),
    };
  });
}
