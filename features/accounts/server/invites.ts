import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, gt, isNull, ne, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { invites, shops, users, type Role } from '@/db/schema';
import { hashPassword } from '@/server/auth/password';
import type { Member } from '@/server/auth/session';
import { env } from '@/server/env.mjs';
import { DomainError, notFound } from '@/server/errors';
import { sendMail } from '@/server/mail/mailer';
import { getShopSettings } from '@/server/shop/settings';
import type { AcceptInviteInput, InviteInput } from '../schemas';
import { inviteMail } from './invite-mail';
import { inviteToExistingAccountMail } from './notice-mail';

export type PendingInvite = { id: string; email: string; role: Role; expiresAt: string };

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
const HAS_ACCOUNT = 'This address already has a Ringpass account.';
export const INVITE_UNUSABLE =
  'This invite link has expired, was revoked or was already used. Ask your lead for a new one.';

const usable = () =>
  and(isNull(invites.acceptedAt), isNull(invites.revokedAt), gt(invites.expiresAt, sql`now()`));

/**
 * Creates an invite and e-mails its link. A newer invite to the same address replaces the older
 * one, but only once its e-mail is accepted by the mail server: if the mail fails, the new invite
 * is removed and the older one still works, so the person is never left without a working link.
 *
 * An address that already has an account gets the same answer as any other (the lead must not
 * learn who has an account): an invite row that no link points to, and the address's owner gets a
 * notice instead of a link.
 */
export async function createInvite(actor: Member, input: InviteInput): Promise<PendingInvite> {
  const db = getDb();
  const [existing] = await db
    .select({ shopId: users.shopId })
    .from(users)
    .where(eq(users.email, input.email));

  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + env().INVITE_TTL_HOURS * 3_600_000);
  const [invite] = await db
    .insert(invites)
    .values({
      shopId: actor.shopId,
      email: input.email,
      role: input.role,
      tokenHash: hashToken(token),
      invitedById: actor.userId,
      expiresAt,
    })
    .returning({ id: invites.id });

  const [[shop], { timeZone }] = await Promise.all([
    db.select({ name: shops.name }).from(shops).where(eq(shops.id, actor.shopId)),
    getShopSettings(actor.shopId),
  ]);
  const shopName = shop?.name ?? 'your shop';
  const link = new URL(`/invite/${token}`, env().APP_URL).toString();
  try {
    if (existing) {
      // The notice belongs to the owner's shop, so the inviting lead's Mailbox never shows it.
      await sendMail({
        to: input.email,
        shopId: existing.shopId,
        ...inviteToExistingAccountMail({ shopName, inviterName: actor.name }),
      });
    } else {
      await sendMail({
        to: input.email,
        shopId: actor.shopId,
        ...inviteMail({
          shopName,
          inviterName: actor.name,
          role: input.role,
          link,
          expiresAt,
          timeZone,
        }),
      });
    }
  } catch (error) {
    console.error('[invite] mail failed', error);
    await db.delete(invites).where(eq(invites.id, invite!.id));
    throw new DomainError(
      'invalid',
      'The invite e-mail could not be sent, so no invite was created. Try again in a moment.',
    );
  }
  await db
    .update(invites)
    .set({ revokedAt: new Date() })
    .where(
      and(
        eq(invites.shopId, actor.shopId),
        eq(invites.email, input.email),
        ne(invites.id, invite!.id),
        usable(),
      ),
    );
  return {
    id: invite!.id,
    email: input.email,
    role: input.role,
    expiresAt: expiresAt.toISOString(),
  };
}

export async function listPendingInvites(shopId: string): Promise<PendingInvite[]> {
  const rows = await getDb()
    .select({
      id: invites.id,
      email: invites.email,
      role: invites.role,
      expiresAt: invites.expiresAt,
    })
    .from(invites)
    .where(and(eq(invites.shopId, shopId), usable()))
    .orderBy(desc(invites.createdAt));
  return rows.map((r) => ({ ...r, expiresAt: r.expiresAt.toISOString() }));
}

export async function revokeInvite(actor: Member, inviteId: string): Promise<void> {
  const rows = await getDb()
    .update(invites)
    .set({ revokedAt: new Date() })
    .where(and(eq(invites.id, inviteId), eq(invites.shopId, actor.shopId), usable()))
    .returning({ id: invites.id });
  if (!rows.length) throw notFound('That invite');
}

/** What the invite page shows before the person accepts; null when the link cannot be used. */
export async function findUsableInvite(token: string) {
  const [row] = await getDb()
    .select({ email: invites.email, role: invites.role, shopName: shops.name })
    .from(invites)
    .innerJoin(shops, eq(shops.id, invites.shopId))
    .where(and(eq(invites.tokenHash, hashToken(token)), usable()));
  return row ?? null;
}

/** Uses the invite exactly once (a conditional update wins the race) and creates the account. */
export async function acceptInvite(
  input: AcceptInviteInput,
): Promise<{ userId: string; role: Role }> {
  const passwordHash = await hashPassword(input.password);
  return getDb().transaction(async (tx) => {
    const [invite] = await tx
      .update(invites)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invites.tokenHash, hashToken(input.token)), usable()))
      .returning({ shopId: invites.shopId, email: invites.email, role: invites.role });
    if (!invite) throw new DomainError('invalid', INVITE_UNUSABLE);
    const [taken] = await tx
      .select({ id: users.id })
      .from(users)
      .where(eq(users.email, invite.email));
    if (taken) throw new DomainError('conflict', HAS_ACCOUNT);
    const [user] = await tx
      .insert(users)
      .values({
        shopId: invite.shopId,
        email: invite.email,
        name: input.name,
        role: invite.role,
        passwordHash,
      })
      .returning({ id: users.id });
    return { userId: user!.id, role: invite.role };
  });
}
