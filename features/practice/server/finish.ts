import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { practiceAttempts } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { notFound } from '@/server/errors';
import { scoreAttempt } from '../scoring';
import type { PracticeResult, PracticeSetup } from '../types';
import { listPracticeEvents } from './attempts';

/**
 * Ends the member's own attempt: the events stored so far are scored by the pure module and the
 * score and result are stored once. Finishing again (a double tap, a retry after a dropped
 * answer) returns the stored result unchanged.
 */
export async function finishAttempt(
  member: Member,
  attemptId: string,
  now = new Date(),
): Promise<{ score: number; result: PracticeResult; finishedAt: string }> {
  return getDb().transaction(async (tx) => {
    const [attempt] = await tx
      .select({
        userId: practiceAttempts.userId,
        setup: practiceAttempts.setup,
        finishedAt: practiceAttempts.finishedAt,
        score: practiceAttempts.score,
        result: practiceAttempts.result,
      })
      .from(practiceAttempts)
      .where(and(eq(practiceAttempts.shopId, member.shopId), eq(practiceAttempts.id, attemptId)))
      .for('update');
    if (!attempt || attempt.userId !== member.userId) throw notFound('That attempt');
    if (attempt.finishedAt && attempt.result && attempt.score !== null)
      return {
        score: attempt.score,
        result: attempt.result as PracticeResult,
        finishedAt: attempt.finishedAt.toISOString(),
      };
    const events = await listPracticeEvents(member.shopId, attemptId);
    const result = scoreAttempt(attempt.setup as PracticeSetup, events);
    await tx
      .update(practiceAttempts)
      .set({
        finishedAt: now,
        score: result.score,
        result: result as unknown as Record<string, unknown>,
      })
      .where(and(eq(practiceAttempts.shopId, member.shopId), eq(practiceAttempts.id, attemptId)));
    return { score: result.score, result, finishedAt: now.toISOString() };
  });
}
