import { describe, expect, it } from 'vitest';
import { inviteMember } from '@/features/accounts/actions/invite-member';
import { findUsableInvite, listPendingInvites } from '@/features/accounts/server/invites';
import { sendMail } from '@/server/mail/mailer';
import { createTestShop } from '@/tests/helpers/factories';
import { inviteToken, waitForMail } from '@/tests/helpers/mailbox';
import { actAs } from '@/tests/helpers/next-request';
import { drainQueues } from '@/tests/helpers/queue';
import { INTEGRATION_SINK } from '@/tests/helpers/test-services';

// Invite e-mails go from the queue; here it is worked by hand, once per call, with the real
// mailer or a mail server that refuses everything. Retries wait for nothing (ignoreStartAfter).
const INVITES = { names: ['invite-email' as const], ignoreStartAfter: true };
const refuse = async () => {
  throw new Error('451 4.3.0 mail server busy, try again later');
};

describe('an invite whose e-mail the mail server refuses', () => {
  it('is retried, then withdrawn; the invite sent before keeps working all along', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    expect(
      await inviteMember(null, { email: 'patient@example.test', role: 'technician' }),
    ).toMatchObject({ ok: true });
    await drainQueues({ send: sendMail }, INVITES);
    const firstToken = inviteToken(await waitForMail(INTEGRATION_SINK.dir, 'patient@example.test'));

    expect(await inviteMember(null, { email: 'patient@example.test', role: 'lead' })).toMatchObject(
      { ok: true },
    );
    await drainQueues({ send: refuse }, INVITES);
    // Waiting for a retry: the older link still works, both are listed.
    expect(await findUsableInvite(firstToken)).toMatchObject({ role: 'technician' });
    while (await drainQueues({ send: refuse }, INVITES));

    expect(await findUsableInvite(firstToken)).toMatchObject({
      email: 'patient@example.test',
      role: 'technician',
    });
    expect((await listPendingInvites(shop.shopId)).map((i) => i.role)).toEqual(['technician']);
  });

  it('once a newer invite’s e-mail is accepted, the older link stops working', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    await inviteMember(null, { email: 'twice@example.test', role: 'apprentice' });
    await drainQueues({ send: sendMail }, INVITES);
    const firstToken = inviteToken(await waitForMail(INTEGRATION_SINK.dir, 'twice@example.test'));
    await inviteMember(null, { email: 'twice@example.test', role: 'technician' });
    await drainQueues({ send: sendMail }, INVITES);
    expect(await findUsableInvite(firstToken)).toBeNull();
    expect((await listPendingInvites(shop.shopId)).map((i) => i.role)).toEqual(['technician']);
  });

  it('is sent once, even when two workers take it at the same moment', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    await inviteMember(null, { email: 'once@example.test', role: 'technician' });
    const sent: string[] = [];
    const count = async (m: { to: string }) => void sent.push(m.to);
    await Promise.all([
      drainQueues({ send: count }, INVITES),
      drainQueues({ send: count }, INVITES),
    ]);
    await drainQueues({ send: count }, INVITES);
    expect(sent.filter((to) => to === 'once@example.test')).toHaveLength(1);
  });
});
