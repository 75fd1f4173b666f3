import 'server-only';
import { and, asc, count, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { users, type Role } from '@/db/schema';
import { endAllSessionsOf, type Member } from '@/server/auth/session';
import { DomainError, notFound } from '@/server/errors';

export type TeamMember = { id: string; name: string; email: string; role: Role; joinedAt: string };

const columns = {
  id: users.id,
  name: users.name,
  email: users.email,
  role: users.role,
  createdAt: users.createdAt,
};

const toDto = (row: { id: string; name: string; email: string; role: Role; createdAt: Date }): TeamMember => ({
  id: row.id,
  name: row.name,
  email: row.email,
  role: row.role,
  joinedAt: row.createdAt.toISOString(),
});

const active = (shopId: string) => and(eq(users.shopId, shopId), isNull(users.removedAt));

export async function listTeam(shopId: string): Promise<TeamMember[]> {
  const rows = await getDb().select(columns).from(users).where(active(shopId)).orderBy(asc(users.name));
  return rows.map(toDto);
}

/** One member of this shop; another shop's id is simply not found. */
export async function getTeamMember(shopId: string, memberId: string): Promise<TeamMember> {
  const [row] = await getDb()
    .select(columns)
    .from(users)
    .where(and(active(shopId), eq(users.id, memberId)));
  if (!row) throw notFound('That team member');
  return toDto(row);
}

async function leadCount(shopId: string): Promise<number> {
  const [row] = await getDb()
    .select({ n: count() })
    .from(users)
    .where(and(active(shopId), eq(users.role, 'lead')));
  return row?.n ?? 0;
}

const LAST_LEAD = 'A shop needs at least one lead. Make someone else a lead first.';

/** Changes a role and ends that person's sessions, so the new role applies from their next sign-in. */
export async function changeRole(actor: Member, memberId: string, role: Role): Promise<TeamMember> {
  const target = await getTeamMember(actor.shopId, memberId);
  if (target.role === role) return target;
  if (target.role === 'lead' && (await leadCount(actor.shopId)) <= 1) {
    throw new DomainError('conflict', LAST_LEAD, { role: [LAST_LEAD] });
  }
  await getDb()
    .update(users)
    .set({ role })
    .where(and(active(actor.shopId), eq(users.id, memberId)));
  await endAllSessionsOf(memberId);
  return { ...target, role };
}

/** Removes a member: they can no longer sign in; their name stays on past records. */
export async function removeMember(actor: Member, memberId: string): Promise<void> {
  const target = await getTeamMember(actor.shopId, memberId);
  if (target.id === actor.userId) {
    throw new DomainError('conflict', 'You cannot remove yourself. Ask another lead to do it.');
  }
  if (target.role === 'lead' && (await leadCount(actor.shopId)) <= 1) throw new DomainError('conflict', LAST_LEAD);
  await getDb()
    .update(users)
    .set({ removedAt: new Date() })
    .where(and(active(actor.shopId), eq(users.id, memberId)));
  await endAllSessionsOf(memberId);
}
