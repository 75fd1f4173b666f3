import { and, eq, isNull } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { invites, users } from '@/db/schema';
import { acceptTeamInvite } from '@/features/accounts/actions/accept-invite';
import { changeMemberRole } from '@/features/accounts/actions/change-role';
import { inviteMember } from '@/features/accounts/actions/invite-member';
import { removeTeamMember } from '@/features/accounts/actions/remove-member';
import { revokeTeamInvite } from '@/features/accounts/actions/revoke-invite';
import { findUsableInvite } from '@/features/accounts/server/invites';
import { changeRole, removeMember } from '@/features/accounts/server/team';
import { createSessionCookie, validateSessionId } from '@/server/auth/session';
import { createTestShop } from '@/tests/helpers/factories';
import { deliveredInvite } from '@/tests/helpers/invite-link';
import { inviteToken, waitForMail } from '@/tests/helpers/mailbox';
import { runQueueWorker } from '@/tests/helpers/queue';
import { actAs, resetNextRequest } from '@/tests/helpers/next-request';
import { INTEGRATION_SINK } from '@/tests/helpers/test-services';

// Invite e-mails go out from the queue: a worker runs for this file, as `npm run worker` would.
runQueueWorker();

describe('invites', () => {
  it('a lead invites by e-mail; the link works once and creates a member with that role', async () => {
    const shop = await createTestShop('Invite Shop');
    await actAs(shop.lead.userId);
    const sent = await inviteMember(null, { email: 'New.Tech@Example.test', role: 'technician' });
    expect(sent).toMatchObject({
      ok: true,
      data: { email: 'new.tech@example.test', role: 'technician' },
    });

    const { mail, token } = await deliveredInvite('new.tech@example.test');
    expect(mail.subject).toBe('Lena Lead invited you to Invite Shop on Ringpass');
    expect(await findUsableInvite(token)).toMatchObject({
      email: 'new.tech@example.test',
      shopName: 'Invite Shop',
    });
    expect(await getDb().$count(invites, eq(invites.tokenHash, token))).toBe(0); // only the hash is stored

    resetNextRequest();
    // A new technician starts at their wheels, as after every sign-in.
    await expect(
      acceptTeamInvite(null, { token, name: 'Nia Newhand', password: 'twelve chars at least' }),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/my-wheels') });
    const [created] = await getDb()
      .select()
      .from(users)
      .where(eq(users.email, 'new.tech@example.test'));
    expect(created).toMatchObject({ shopId: shop.shopId, role: 'technician', name: 'Nia Newhand' });

    expect(
      await acceptTeamInvite(null, { token, name: 'Again', password: 'twelve chars at least' }),
    ).toMatchObject({
      ok: false,
      message: expect.stringMatching(/expired, was revoked or was already used/),
    });
  });

  it('an expired or revoked link is refused', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    await inviteMember(null, { email: 'late@example.test', role: 'apprentice' });
    const { token } = await deliveredInvite('late@example.test');
    await getDb()
      .update(invites)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(invites.email, 'late@example.test'));
    expect(await findUsableInvite(token)).toBeNull();
    expect(
      await acceptTeamInvite(null, { token, name: 'Late', password: 'twelve chars at least' }),
    ).toMatchObject({ ok: false });

    await actAs(shop.lead.userId);
    const second = await inviteMember(null, { email: 'gone@example.test', role: 'apprentice' });
    const { token: secondToken } = await deliveredInvite('gone@example.test');
    expect(
      await revokeTeamInvite(null, { inviteId: second.ok ? second.data.id : '' }),
    ).toMatchObject({ ok: true });
    expect(await findUsableInvite(secondToken)).toBeNull();
  });

  it('only a lead can invite; a technician and an apprentice are refused and nothing is created', async () => {
    const shop = await createTestShop();
    for (const who of [shop.technician, shop.apprentice]) {
      await actAs(who.userId);
      expect(
        await inviteMember(null, { email: `x-${who.role}@example.test`, role: 'lead' }),
      ).toEqual({ ok: false, code: 'forbidden', message: 'Your role does not allow this.' });
    }
    expect(await getDb().$count(invites, eq(invites.shopId, shop.shopId))).toBe(0);
  });

  it('signed out, the action refuses', async () => {
    resetNextRequest();
    expect(await inviteMember(null, { email: 'x@example.test', role: 'technician' })).toMatchObject(
      { ok: false, message: expect.stringMatching(/Sign in again/) },
    );
  });

  it('bad input gets field errors', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    expect(await inviteMember(null, { email: 'nope', role: 'owner' as never })).toMatchObject({
      ok: false,
      fieldErrors: {
        email: [expect.any(String)],
        role: ['Choose a role: lead, technician or apprentice.'],
      },
    });
  });

  it('an address that already has an account gets the same answer as a new one; its owner is told by e-mail and gets no link', async () => {
    const shop = await createTestShop('Asking Shop');
    const other = await createTestShop('Other');
    await actAs(shop.lead.userId);
    const taken = await inviteMember(null, { email: other.technician.email, role: 'technician' });
    const fresh = await inviteMember(null, {
      email: 'fresh-face@example.test',
      role: 'technician',
    });
    const shape = (r: typeof taken) =>
      r.ok
        ? { ok: r.ok, keys: Object.keys(r.data).sort(), role: r.data.role, message: r.message }
        : r;
    expect(shape(taken)).toEqual(shape(fresh));
    expect(taken).toMatchObject({ ok: true, data: { email: other.technician.email } });

    const notice = await waitForMail(INTEGRATION_SINK.dir, other.technician.email);
    expect(notice.subject).toBe('Lena Lead tried to invite you to Asking Shop on Ringpass');
    expect(notice.text).toMatch(/already has a Ringpass account/);
    expect(inviteToken(notice)).toBe('');
    expect(notice.shopId).toBe(other.shopId); // never in the inviting shop's Mailbox
  });
});

describe('roles and removal', () => {
  it('changing a role ends that person’s sessions', async () => {
    const shop = await createTestShop();
    const techSession = await createSessionCookie(shop.technician.userId);
    await actAs(shop.lead.userId);
    expect(
      await changeMemberRole(null, { memberId: shop.technician.userId, role: 'lead' }),
    ).toMatchObject({ ok: true, data: { role: 'lead' } });
    expect(await validateSessionId(techSession.value)).toBeNull();
  });

  it('the last lead cannot be demoted', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    expect(
      await changeMemberRole(null, { memberId: shop.lead.userId, role: 'technician' }),
    ).toMatchObject({ ok: false, message: expect.stringMatching(/at least one lead/) });
  });

  it('another shop’s member is not found, and is left untouched', async () => {
    const shop = await createTestShop();
    const other = await createTestShop('Other');
    await actAs(shop.lead.userId);
    expect(
      await changeMemberRole(null, { memberId: other.technician.userId, role: 'apprentice' }),
    ).toMatchObject({ ok: false, message: 'That team member was not found.' });
    expect(await removeTeamMember(null, { memberId: other.technician.userId })).toMatchObject({
      ok: false,
      message: 'That team member was not found.',
    });
    const [row] = await getDb()
      .select({ role: users.role, removedAt: users.removedAt })
      .from(users)
      .where(eq(users.id, other.technician.userId));
    expect(row).toEqual({ role: 'technician', removedAt: null });
  });

  it('removing a member signs them out for good', async () => {
    const shop = await createTestShop();
    const session = await createSessionCookie(shop.apprentice.userId);
    await actAs(shop.lead.userId);
    await expect(
      removeTeamMember(null, { memberId: shop.apprentice.userId }),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/team') });
    expect(await validateSessionId(session.value)).toBeNull();
  });

  it('two leads demoted at once: one is refused, the shop keeps a lead', async () => {
    const shop = await createTestShop();
    await getDb().update(users).set({ role: 'lead' }).where(eq(users.id, shop.technician.userId));
    const secondLead = { ...shop.technician, role: 'lead' as const };
    // Each lead demotes the other, each in their own request (through the service, as below: one
    // person's two requests through the action race their own session's end instead).
    const results = await Promise.allSettled([
      changeRole(shop.lead, secondLead.userId, 'technician'),
      changeRole(secondLead, shop.lead.userId, 'technician'),
    ]);
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    expect(results.filter((r) => r.status === 'rejected')).toEqual([
      expect.objectContaining({
        reason: expect.objectContaining({ message: expect.stringMatching(/at least one lead/) }),
      }),
    ]);
    expect(
      await getDb().$count(users, and(eq(users.shopId, shop.shopId), eq(users.role, 'lead'))),
    ).toBe(1);
  });

  it('two leads removing each other at once: one is refused, the shop keeps a lead', async () => {
    const shop = await createTestShop();
    await getDb().update(users).set({ role: 'lead' }).where(eq(users.id, shop.technician.userId));
    const secondLead = { ...shop.technician, role: 'lead' as const };
    const results = await Promise.allSettled([
      removeMember(shop.lead, secondLead.userId),
      removeMember(secondLead, shop.lead.userId),
    ]);
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
    expect(results.filter((r) => r.status === 'rejected')).toEqual([
      expect.objectContaining({
        reason: expect.objectContaining({ message: expect.stringMatching(/at least one lead/) }),
      }),
    ]);
    expect(
      await getDb().$count(
        users,
        and(eq(users.shopId, shop.shopId), eq(users.role, 'lead'), isNull(users.removedAt)),
      ),
    ).toBe(1);
  });

  it('removing a lead revokes the invites they sent', async () => {
    const shop = await createTestShop('Two Lead Shop');
    await getDb().update(users).set({ role: 'lead' }).where(eq(users.id, shop.technician.userId));
    await actAs(shop.technician.userId);
    expect(
      await inviteMember(null, { email: 'sent-by-leaver@example.test', role: 'lead' }),
    ).toMatchObject({ ok: true });
    const { token } = await deliveredInvite('sent-by-leaver@example.test');
    expect(await findUsableInvite(token)).not.toBeNull();

    await actAs(shop.lead.userId);
    await expect(
      removeTeamMember(null, { memberId: shop.technician.userId }),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/team') });
    expect(await findUsableInvite(token)).toBeNull();
    resetNextRequest();
    expect(
      await acceptTeamInvite(null, { token, name: 'Too Late', password: 'twelve chars at least' }),
    ).toMatchObject({ ok: false });
  });

  it('a lead made a technician loses the invites they sent too', async () => {
    const shop = await createTestShop('Demotion Shop');
    await getDb().update(users).set({ role: 'lead' }).where(eq(users.id, shop.technician.userId));
    await actAs(shop.technician.userId);
    await inviteMember(null, { email: 'sent-before-demotion@example.test', role: 'lead' });
    const { token } = await deliveredInvite('sent-before-demotion@example.test');
    await actAs(shop.lead.userId);
    expect(
      await changeMemberRole(null, { memberId: shop.technician.userId, role: 'technician' }),
    ).toMatchObject({ ok: true });
    expect(await findUsableInvite(token)).toBeNull();
  });
});
