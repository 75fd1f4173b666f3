import { describe, expect, it, vi } from 'vitest';
import { inviteMember } from '@/features/accounts/actions/invite-member';
import { findUsableInvite, listPendingInvites } from '@/features/accounts/server/invites';
import type * as Mailer from '@/server/mail/mailer';
import { sendMail } from '@/server/mail/mailer';
import { createTestShop } from '@/tests/helpers/factories';
import { inviteToken, waitForMail } from '@/tests/helpers/mailbox';
import { actAs } from '@/tests/helpers/next-request';
import { INTEGRATION_SINK } from '@/tests/helpers/test-services';

// The real mailer, with a way to make the mail server refuse the next message.
vi.mock('@/server/mail/mailer', async (importOriginal) => {
  const real = await importOriginal<typeof Mailer>();
  return { ...real, sendMail: vi.fn(real.sendMail) };
});

describe('an invite whose e-mail the mail server refuses', () => {
  it('is not created, and the invite sent before keeps working', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    expect(
      await inviteMember(null, { email: 'patient@example.test', role: 'technician' }),
    ).toMatchObject({ ok: true });
    const firstToken = inviteToken(await waitForMail(INTEGRATION_SINK.dir, 'patient@example.test'));

    vi.mocked(sendMail).mockRejectedValueOnce(
      new Error('451 4.3.0 mail server busy, try again later'),
    );
    expect(await inviteMember(null, { email: 'patient@example.test', role: 'lead' })).toMatchObject(
      {
        ok: false,
        message: expect.stringMatching(/could not be sent, so no invite was created/),
      },
    );

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
    const firstToken = inviteToken(await waitForMail(INTEGRATION_SINK.dir, 'twice@example.test'));
    await inviteMember(null, { email: 'twice@example.test', role: 'technician' });
    expect(await findUsableInvite(firstToken)).toBeNull();
    expect((await listPendingInvites(shop.shopId)).map((i) => i.role)).toEqual(['technician']);
  });
});
