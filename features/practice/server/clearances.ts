import 'server-only';
import { and, asc, count, desc, eq, inArray, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { getDb } from '@/db';
import { jobs, practiceClearances, users } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';
import type { ClearApprenticeInput } from '../clearance-schemas';

/** Job states in which an assignee still has wheels to run. */
const UNFINISHED = ['open', 'in_progress', 'sent_back'] as const;

async function apprenticeOf(shopId: string, userId: string) {
  const [person] = await getDb()
    .select({ id: users.id, name: users.name, role: users.role })
    .from(users)
    .where(and(eq(users.shopId, shopId), eq(users.id, userId), isNull(users.removedAt)));
  if (!person) throw notFound('That person');
  if (person.role !== 'apprentice') {
    const message = `${person.name} is not an apprentice: leads and technicians run real wheels by their role.`;
    throw new DomainError('invalid', message, { userId: [message] });
  }
  return person;
}

function isUniqueViolation(error: unknown) {
  const cause = (error as { cause?: { code?: string } })?.cause ?? error;
  return (cause as { code?: string })?.code === '23505';
}

/** Records the lead's word that this apprentice may run real wheels (who, when, the note). */
export async function clearApprentice(lead: Member, input: ClearApprenticeInput) {
  const person = await apprenticeOf(lead.shopId, input.userId);
  const already = `${person.name} is already cleared for real wheels.`;
  try {
    const [row] = await getDb()
      .insert(practiceClearances)
      .values({
        shopId: lead.shopId,
        userId: person.id,
        clearedById: lead.userId,
        note: input.note,
      })
      .onConflictDoNothing()
      .returning({ id: practiceClearances.id, clearedAt: practiceClearances.clearedAt });
    if (!row) throw new DomainError('conflict', already);
    return { id: row.id, userId: person.id, clearedAt: row.clearedAt.toISOString() };
  } catch (error) {
    if (isUniqueViolation(error)) throw new DomainError('conflict', already);
    throw error;
  }
}

/**
 * Takes the clearance back; the row stays with who revoked it and when. Job cards already
 * assigned to the apprentice stay assigned (the lead sees a warning and reassigns them); the
 * runner refuses the apprentice from their next request.
 */
export async function revokeClearance(lead: Member, userId: string) {
  const person = await apprenticeOf(lead.shopId, userId);
  const [row] = await getDb()
    .update(practiceClearances)
    .set({ revokedById: lead.userId, revokedAt: new Date() })
    .where(
      and(
        eq(practiceClearances.shopId, lead.shopId),
        eq(practiceClearances.userId, person.id),
        isNull(practiceClearances.revokedAt),
      ),
    )
    .returning({ id: practiceClearances.id, revokedAt: practiceClearances.revokedAt });
  if (!row) throw new DomainError('conflict', `${person.name} is not cleared for real wheels.`);
  return { id: row.id, userId: person.id, revokedAt: row.revokedAt!.toISOString() };
}

export type ClearanceRecord = {
  id: string;
  clearedBy: string;
  clearedAt: Date;
  note: string;
  revokedBy: string | null;
  revokedAt: Date | null;
};

export type ApprenticeStanding = {
  userId: string;
  name: string;
  /** Newest first; the first is standing when it has no revokedAt. */
  history: ClearanceRecord[];
  cleared: boolean;
  /** Job cards still assigned to them with wheels to run (a warning once the clearance is revoked). */
  unfinishedJobs: number;
};

/** The shop's apprentices (or one of them) with their clearance history. */
export async function listApprenticeStanding(
  shopId: string,
  filter: { userId?: string } = {},
): Promise<ApprenticeStanding[]> {
  const db = getDb();
  const people = await db
    .select({ userId: users.id, name: users.name })
    .from(users)
    .where(
      and(
        eq(users.shopId, shopId),
        eq(users.role, 'apprentice'),
        isNull(users.removedAt),
        filter.userId ? eq(users.id, filter.userId) : undefined,
      ),
    )
    .orderBy(asc(users.name));
  const ids = people.map((p) => p.userId);
  if (ids.length === 0) return [];
  const clearer = alias(users, 'clearer');
  const revoker = alias(users, 'revoker');
  const [records, assigned] = await Promise.all([
    db
      .select({
        id: practiceClearances.id,
        userId: practiceClearances.userId,
        clearedBy: clearer.name,
        clearedAt: practiceClearances.clearedAt,
        note: practiceClearances.note,
        revokedBy: revoker.name,
        revokedAt: practiceClearances.revokedAt,
      })
      .from(practiceClearances)
      .innerJoin(clearer, eq(clearer.id, practiceClearances.clearedById))
      .leftJoin(revoker, eq(revoker.id, practiceClearances.revokedById))
      .where(and(eq(practiceClearances.shopId, shopId), inArray(practiceClearances.userId, ids)))
      .orderBy(desc(practiceClearances.clearedAt)),
    db
      .select({ userId: jobs.assigneeId, n: count() })
      .from(jobs)
      .where(
        and(
          eq(jobs.shopId, shopId),
          inArray(jobs.assigneeId, ids),
          inArray(jobs.state, UNFINISHED),
        ),
      )
      .groupBy(jobs.assigneeId),
  ]);
  return people.map((p) => {
    const history: ClearanceRecord[] = records
      .filter((r) => r.userId === p.userId)
      .map((r) => ({
        id: r.id,
        clearedBy: r.clearedBy,
        clearedAt: r.clearedAt,
        note: r.note,
        revokedBy: r.revokedBy,
        revokedAt: r.revokedAt,
      }));
    return {
      ...p,
      history,
      cleared: history.some((r) => r.revokedAt === null),
      unfinishedJobs: assigned.find((a) => a.userId === p.userId)?.n ?? 0,
    };
  });
}
