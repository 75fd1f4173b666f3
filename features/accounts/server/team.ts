import 'server-only';
import { and, asc, eq, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { invites, users, type Role } from '@/db/schema';
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

const toDto = (row: {
  id: string;
  name: string;
  email: string;
  role: Role;
  createdAt: Date;
}): TeamMember => ({
  id: row.id,
  name: row.name,
  email: row.email,
  role: row.role,
  joinedAt: row.createdAt.toISOString(),
});

const active = (shopId: string) => and(eq(users.shopId, shopId), isNull(users.removedAt));

export async function listTeam(shopId: string): Promise<TeamMember[]> {
  const rows = await getDb()
    .select(columns)
    .from(users)
    .where(active(shopId))
    .orderBy(asc(users.name));
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

const LAST_LEAD = 'A shop needs at least one lead. Make someone else a lead first.';

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

/**
 * Locks the shop's current leads (FOR UPDATE) and says whether one other than `memberId` stays.
 * Two leads demoted or removed at once both wait here; the second sees the first's change and
 * is refused, so a shop is never left without a lead.
 */
async function anotherLeadRemains(tx: Tx, shopId: string, memberId: string): Promise<boolean> {
  const leads = await tx
    .select({ id: users.id })
    .from(users)
    .where(and(active(shopId), eq(users.role, 'lead')))
    .orderBy(asc(users.id))
    .for('update');
  return leads.some((l) => l.id !== memberId);
}

/** A lead's pending invites go with their rights: removed or no longer a lead, they stop working. */
async function revokeInvitesSentBy(tx: Tx, shopId: string, memberId: string) {
  await tx
    .update(invites)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(invites.shopId, shopId),
        eq(invites.invitedById, memberId),
        isNull(invites.acceptedAt),
        isNull(invites.revokedAt),
      ),
    );
}

/** Changes a role and ends that person's sessions, so the new role applies from their next sign-in. */
export async function changeRole(actor: Member, memberId: string, role: Role): Promise<TeamMember> {
  const target = await getTeamMember(actor.shopId, memberId);
  if (target.role === role) return target;
  await getDb().transaction(async (tx) => {
    if (target.role === 'lead' && !(await anotherLeadRemains(tx, actor.shopId, memberId))) {
      throw new DomainError('conflict', LAST_LEAD, { role: [LAST_LEAD] });
    }
    // Only from the role we read: a change made meanwhile wins and this one is told.
    const changed = await tx
      .update(users)
      .set({ role })
      .where(and(active(actor.shopId), eq(users.id, memberId), eq(users.role, target.role)))
      .returning({ id: users.id });
    if (!changed.length)
      throw new DomainError('conflict', 'This member changed meanwhile; reload and try again.');
    if (target.role === 'lead') await revokeInvitesSentBy(tx, actor.shopId, memberId);
  });
  await endAllSessionsOf(memberId);
  return { ...target, role };
}

/** Removes a member: they can no longer sign in; their name stays on past records. */
export async function removeMember(actor: Member, memberId: string): Promise<void> {
  const target = await getTeamMember(actor.shopId, memberId);
  if (target.id === actor.userId) {
    throw new DomainError('conflict', 'You cannot remove yourself. Ask another lead to do it.');
  }
  await getDb().transaction(async (tx) => {
    if (target.role === 'lead' && !(await anotherLeadRemains(tx, actor.shopId, memberId)))
      throw new DomainError('conflict', LAST_LEAD);
    const removed = await tx
      .update(users)
      .set({ removedAt: new Date() })
      .where(and(active(actor.shopId), eq(users.id, memberId)))
      .returning({ id: users.id });
    if (!removed.length) throw notFound('That team member');
    await revokeInvitesSentBy(tx, actor.shopId, memberId);
  });
  await endAllSessionsOf(memberId);
}
