import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { and, desc, eq, gt, isNull, like, lt, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { invites, shops, users, type Role } from '@/db/schema';
import { hashPassword } from '@/server/auth/password';
import type { Member } from '@/server/auth/session';
import { env } from '@/server/env.mjs';
import { DomainError, notFound } from '@/server/errors';
import type { OutgoingMail } from '@/server/mail/mailer';
import { sendJob } from '@/server/queue/boss';
import { isLastAttempt, type JobAttempt } from '@/server/queue/jobs';
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

/** Marks an invite whose e-mail has not gone yet: never the SHA-256 (hex) of a token. */
const UNSENT = 'unsent:';

/**
 * Creates an invite; its e-mail goes from the queue (`deliverInvite`), which issues the link. Until
 * that mail is accepted by the mail server the older invite to the same address keeps working; if
 * it never is, the new invite is withdrawn, so the person is never left without a working link.
 */
export async function createInvite(actor: Member, input: InviteInput): Promise<PendingInvite> {
  const expiresAt = new Date(Date.now() + env().INVITE_TTL_HOURS * 3_600_000);
  const [invite] = await getDb()
    .insert(invites)
    .values({
      shopId: actor.shopId,
      email: input.email,
      role: input.role,
      tokenHash: `${UNSENT}${randomBytes(16).toString('hex')}`,
      invitedById: actor.userId,
      expiresAt,
    })
    .returning({ id: invites.id });
  try {
    await sendJob('invite-email', {
      shopId: actor.shopId,
      inviteId: invite!.id,
      inviterName: actor.name,
    });
  } catch (error) {
    console.error('[invite] could not be queued', error);
    await getDb().delete(invites).where(eq(invites.id, invite!.id));
    throw new DomainError(
      'invalid',
      'The invite e-mail could not be sent, so no invite was created. Try again in a moment.',
    );
  }
  return {
    id: invite!.id,
    email: input.email,
    role: input.role,
    expiresAt: expiresAt.toISOString(),
  };
}

/**
 * The queue's side of an invite, once: under a lock on the invite row, an unsent invite gets its
 * token, the e-mail goes, and only then does the row take the token's hash and the older invites
 * to the address stop working. An invite with a newer one to the same address is withdrawn unsent. An address that already has an account gets a notice instead of a
 * link (the lead must not learn who has an account). A failed send is retried by the queue; after
 * the last try the invite is withdrawn and the older one still works.
 */
export async function deliverInvite(
  data: { shopId: string; inviteId: string; inviterName: string },
  attempt: JobAttempt,
  send: (mail: OutgoingMail) => Promise<void>,
): Promise<void> {
  const failed = await getDb().transaction(async (tx) => {
    const mine = and(eq(invites.shopId, data.shopId), eq(invites.id, data.inviteId));
    const [invite] = await tx
      .select({
        email: invites.email,
        role: invites.role,
        expiresAt: invites.expiresAt,
      })
      .from(invites)
      .where(and(mine, like(invites.tokenHash, `${UNSENT}%`), usable()))
      .for('update');
    if (!invite) return null; // sent already, revoked, used or expired
    const sameAddress = and(eq(invites.shopId, data.shopId), eq(invites.email, invite.email));
    // Compared in SQL: a JS Date would drop the microseconds and find this very row newer.
    const myCreatedAt = sql`(${tx
      .select({ createdAt: invites.createdAt })
      .from(invites)
      .where(eq(invites.id, data.inviteId))})`;
    // A lead who re-invited (say, with a corrected role) meant the newer invite: this one is
    // withdrawn unsent, so the wrong role never reaches the person.
    const [newer] = await tx
      .select({ id: invites.id })
      .from(invites)
      .where(and(sameAddress, gt(invites.createdAt, myCreatedAt), usable()))
      .limit(1);
    if (newer) {
      await tx.update(invites).set({ revokedAt: new Date() }).where(mine);
      return null;
    }
    const [[existing], [shop], { timeZone }] = await Promise.all([
      tx.select({ shopId: users.shopId }).from(users).where(eq(users.email, invite.email)),
      tx.select({ name: shops.name }).from(shops).where(eq(shops.id, data.shopId)),
      getShopSettings(data.shopId),
    ]);
    const shopName = shop?.name ?? 'your shop';
    const token = randomBytes(32).toString('base64url');
    try {
      await send(
        existing
          ? {
              // The notice belongs to the owner's shop, so the inviting lead's Mailbox never shows it.
              to: invite.email,
              shopId: existing.shopId,
              ...inviteToExistingAccountMail({ shopName, inviterName: data.inviterName }),
            }
          : {
              to: invite.email,
              shopId: data.shopId,
              ...inviteMail({
                shopName,
                inviterName: data.inviterName,
                role: invite.role,
                link: new URL(`/invite/${token}`, env().APP_URL).toString(),
                expiresAt: invite.expiresAt,
                timeZone,
              }),
            },
      );
    } catch (error) {
      if (isLastAttempt(attempt)) await tx.delete(invites).where(mine);
      return error;
    }
    await tx
      .update(invites)
      .set({ tokenHash: hashToken(token) })
      .where(mine);
    await tx
      .update(invites)
      .set({ revokedAt: new Date() })
      .where(and(sameAddress, lt(invites.createdAt, myCreatedAt), usable()));
    return null;
  });
  if (failed) throw failed;
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
