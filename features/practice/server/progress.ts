import 'server-only';
import { and, desc, eq, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { practiceAttempts, users } from '@/db/schema';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import type { ProgressAttempt } from '../progress';
import { listApprenticeStanding, type ApprenticeStanding } from './clearances';

/** The newest attempts the progress page lists; the chart and trend are drawn from the same rows. */
const LIMIT = 1000;

/** The shop's attempts (or one person's), newest first, without their events or full setup. */
export async function listProgressAttempts(
  shopId: string,
  filter: { userId?: string } = {},
): Promise<ProgressAttempt[]> {
  return getDb()
    .select({
      id: practiceAttempts.id,
      userId: practiceAttempts.userId,
      personName: users.name,
      level: practiceAttempts.level,
      source: practiceAttempts.source,
      ringName: sql<string>`coalesce(${practiceAttempts.setup} #>> '{snapshot,spec,name}', '')`,
      startedAt: practiceAttempts.startedAt,
      finishedAt: practiceAttempts.finishedAt,
      score: practiceAttempts.score,
    })
    .from(practiceAttempts)
    .innerJoin(users, and(eq(users.id, practiceAttempts.userId), eq(users.shopId, shopId)))
    .where(
      and(
        eq(practiceAttempts.shopId, shopId),
        filter.userId ? eq(practiceAttempts.userId, filter.userId) : undefined,
      ),
    )
    .orderBy(desc(practiceAttempts.startedAt), desc(practiceAttempts.id))
    .limit(LIMIT);
}

export type Progress = {
  /** Whose attempts: the member's own, or the whole shop's for a lead. */
  scope: 'own' | 'shop';
  attempts: ProgressAttempt[];
  apprentices: ApprenticeStanding[];
};

/** A lead sees the shop's attempts and every apprentice's standing; anyone else their own. */
export async function getProgress(member: Member): Promise<Progress> {
  const shop = can(member, 'practice.viewOthers');
  const filter = shop ? {} : { userId: member.userId };
  const [attempts, apprentices] = await Promise.all([
    listProgressAttempts(member.shopId, filter),
    listApprenticeStanding(member.shopId, filter),
  ]);
  return { scope: shop ? 'shop' : 'own', attempts, apprentices };
}
