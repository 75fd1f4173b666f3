import 'server-only';
import { and, asc, desc, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { practiceAttempts, practiceEvents, users } from '@/db/schema';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';
import type { StartAttemptInput } from '../schemas';
import { drawSurpriseSetup, setupFromSpec } from '../surprise';
import type { PracticeEvent, PracticeResult, PracticeSetup } from '../types';
import { practiceSpec, practiceWrenches } from './sources';

const summaryColumns = {
  id: practiceAttempts.id,
  userId: practiceAttempts.userId,
  personName: users.name,
  level: practiceAttempts.level,
  source: practiceAttempts.source,
  specId: practiceAttempts.specId,
  startedAt: practiceAttempts.startedAt,
  finishedAt: practiceAttempts.finishedAt,
  score: practiceAttempts.score,
};

export type AttemptSummary = Awaited<ReturnType<typeof listAttempts>>[number];
export type Attempt = Awaited<ReturnType<typeof getAttempt>>;

/** The shop's attempts, newest first, or one person's; with the ring's name for the list. */
export async function listAttempts(shopId: string, filter: { userId?: string } = {}) {
  const rows = await getDb()
    .select({ ...summaryColumns, setup: practiceAttempts.setup })
    .from(practiceAttempts)
    .innerJoin(users, eq(users.id, practiceAttempts.userId))
    .where(
      and(
        eq(practiceAttempts.shopId, shopId),
        filter.userId ? eq(practiceAttempts.userId, filter.userId) : undefined,
      ),
    )
    .orderBy(desc(practiceAttempts.startedAt))
    .limit(500);
  return rows.map(({ setup, ...r }) => {
    const s = setup as PracticeSetup;
    return { ...r, ringName: s.snapshot.spec.name, boltCount: s.snapshot.spec.boltCount };
  });
}

/** One attempt of the shop with its setup and result; another shop's is not found. */
export async function getAttempt(shopId: string, attemptId: string) {
  const [row] = await getDb()
    .select({
      ...summaryColumns,
      setup: practiceAttempts.setup,
      result: practiceAttempts.result,
    })
    .from(practiceAttempts)
    .innerJoin(users, eq(users.id, practiceAttempts.userId))
    .where(and(eq(practiceAttempts.shopId, shopId), eq(practiceAttempts.id, attemptId)));
  if (!row) throw notFound('That attempt');
  return {
    ...row,
    setup: row.setup as PracticeSetup,
    result: (row.result ?? null) as PracticeResult | null,
  };
}

/** Whose attempts this member may see: a lead every one of the shop's, anyone else their own. */
export const seesOthers = (member: Member) => can(member.role, 'practice.viewOthers');

/** An attempt this member may see; someone else's (to a non-lead) is not found, like another shop's. */
export async function attemptFor(member: Member, attemptId: string) {
  const attempt = await getAttempt(member.shopId, attemptId);
  if (attempt.userId !== member.userId && !seesOthers(member)) throw notFound('That attempt');
  return attempt;
}

/** The attempts this member may list: their own, or (a lead) anyone's of the shop. */
export async function listAttemptsFor(member: Member, userId?: string) {
  if (userId && userId !== member.userId && !seesOthers(member))
    throw new DomainError('forbidden', 'You can see your own attempts only.');
  return listAttempts(member.shopId, { userId: seesOthers(member) ? userId : member.userId });
}

export async function listPracticeEvents(
  shopId: string,
  attemptId: string,
): Promise<PracticeEvent[]> {
  const rows = await getDb()
    .select({
      clientId: practiceEvents.clientId,
      clientAt: practiceEvents.clientAt,
      type: practiceEvents.type,
      payload: practiceEvents.payload,
      deviceId: practiceEvents.deviceId,
    })
    .from(practiceEvents)
    .where(and(eq(practiceEvents.shopId, shopId), eq(practiceEvents.attemptId, attemptId)))
    .orderBy(asc(practiceEvents.clientAt), asc(practiceEvents.clientId));
  return rows.map(
    ({ deviceId, ...r }) =>
      ({
        ...r,
        clientAt: r.clientAt.toISOString(),
        ...(deviceId ? { deviceId } : {}),
      }) as PracticeEvent,
  );
}

/**
 * Starts an attempt for the member: the ring from one of the shop's specs or drawn at random,
 * the wrenches on offer and the shop's floor fixed in its setup. Writes only `practice_attempts`.
 */
export async function createAttempt(
  member: Member,
  input: StartAttemptInput,
  random: () => number = Math.random,
) {
  const [settings, shopWrenches] = await Promise.all([
    getShopSettings(member.shopId),
    practiceWrenches(member.shopId),
  ]);
  const minFractionOfMax = settings.wrenchFloorPercent / 100;
  const setup =
    input.source === 'spec'
      ? setupFromSpec(await practiceSpec(member.shopId, input.specId), {
          level: input.level,
          shopWrenches,
          minFractionOfMax,
          random,
        })
      : drawSurpriseSetup(random, { level: input.level, shopWrenches, minFractionOfMax });
  const [row] = await getDb()
    .insert(practiceAttempts)
    .values({
      shopId: member.shopId,
      userId: member.userId,
      level: input.level,
      source: input.source,
      specId: input.source === 'spec' ? input.specId : null,
      setup: setup as unknown as Record<string, unknown>,
    })
    .returning({ id: practiceAttempts.id });
  return getAttempt(member.shopId, row!.id);
}
