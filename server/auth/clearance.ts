import 'server-only';
import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { getDb } from '@/db';
import { practiceClearances } from '@/db/schema';

/**
 * Whether a lead has cleared an apprentice for real wheels. The practice feature writes the
 * clearances; the session, the job card's assignee check and the runner only read them, through
 * this one reader in server/ — jobs and the runner cannot import practice, and one definition of
 * "cleared" (a standing row, not revoked, in this shop) keeps assignment and running in step.
 */
type Db = Pick<ReturnType<typeof getDb>, 'select'>;

export async function isClearedForRealWheels(
  shopId: string,
  userId: string,
  db: Db = getDb(),
): Promise<boolean> {
  const [row] = await db
    .select({ id: practiceClearances.id })
    .from(practiceClearances)
    .where(standing(shopId, [userId]))
    .limit(1);
  return Boolean(row);
}

/** Of these people, the ones with a standing clearance (one query for a list of assignees). */
export async function clearedAmong(
  shopId: string,
  userIds: readonly string[],
  db: Db = getDb(),
): Promise<Set<string>> {
  if (userIds.length === 0) return new Set();
  const rows = await db
    .select({ userId: practiceClearances.userId })
    .from(practiceClearances)
    .where(standing(shopId, userIds));
  return new Set(rows.map((r) => r.userId));
}

/**
 * The same rule inside one statement (the runner's one-statement save): a standing clearance for
 * the person whose shop and user id the caller's SQL names.
 */
export function standingClearanceSql(shopId: SQL, userId: SQL): SQL {
  return sql`exists (select 1 from ${practiceClearances} pc where pc.shop_id = ${shopId} and pc.user_id = ${userId} and pc.revoked_at is null)`;
}

function standing(shopId: string, userIds: readonly string[]) {
  return and(
    eq(practiceClearances.shopId, shopId),
    inArray(practiceClearances.userId, [...userIds]),
    isNull(practiceClearances.revokedAt),
  );
}

/** What an apprentice is told when a job would put them on a real wheel before a lead clears them. */
export function notClearedMessage(name: string): string {
  return `${name} is an apprentice not yet cleared for real wheels — a lead clears them on Practice progress.`;
}
