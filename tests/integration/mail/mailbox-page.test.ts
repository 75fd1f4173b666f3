import { isValidElement, type ReactElement } from 'react';
import { describe, expect, it, vi } from 'vitest';
import MailboxPage from '@/app/(shop)/mailbox/page';
import { inviteMember } from '@/features/accounts/actions/invite-member';
import type { SinkMessage } from '@/server/mail/mailbox';
import { createTestShop } from '@/tests/helpers/factories';
import { waitForMail } from '@/tests/helpers/mailbox';
import { runQueueWorker } from '@/tests/helpers/queue';
import { actAs, resetNextRequest } from '@/tests/helpers/next-request';
import { INTEGRATION_SINK } from '@/tests/helpers/test-services';

// next.config.mjs turns this on for the app (experimental.authInterrupts): forbidden() needs it.
vi.stubEnv('__NEXT_EXPERIMENTAL_AUTH_INTERRUPTS', 'true');

async function mailboxAs(userId: string) {
  await actAs(userId);
  const page = (await MailboxPage()) as ReactElement<{ messages: SinkMessage[]; demo: boolean }>;
  expect(isValidElement(page)).toBe(true);
  return page.props;
}

// Invite e-mails go out from the queue: a worker runs for this file, as `npm run worker` would.
runQueueWorker();

describe('the Mailbox page (local mail sink on, not production)', () => {
  it('sends a signed-out visitor to sign-in, and back to the Mailbox afterwards', async () => {
    resetNextRequest();
    await expect(MailboxPage()).rejects.toMatchObject({
      digest: expect.stringMatching(/\/sign-in\?next=%2Fmailbox/),
    });
  });

  it('is forbidden to a technician and an apprentice', async () => {
    const shop = await createTestShop();
    for (const who of [shop.technician, shop.apprentice]) {
      await actAs(who.userId);
      await expect(MailboxPage()).rejects.toMatchObject({ digest: 'NEXT_HTTP_ERROR_FALLBACK;403' });
    }
  });

  it('shows a lead their own shop’s invite, and a lead of another shop never sees it', async () => {
    const shopA = await createTestShop('Shop A');
    const shopB = await createTestShop('Shop B');
    const invited = `new-tech-${Date.now()}@example.test`;
    await actAs(shopA.lead.userId);
    expect(await inviteMember(null, { email: invited, role: 'technician' })).toMatchObject({
      ok: true,
    });
    const mail = await waitForMail(INTEGRATION_SINK.dir, invited);
    expect(mail.shopId).toBe(shopA.shopId); // the sink kept the shop the app named in the mail

    const seenByA = await mailboxAs(shopA.lead.userId);
    expect(seenByA.messages.map((m) => m.to[0])).toContain(invited);
    expect(seenByA.demo).toBe(false);

    const seenByB = await mailboxAs(shopB.lead.userId);
    expect(seenByB.messages.map((m) => m.to[0])).not.toContain(invited);
    expect(seenByB.messages.every((m) => m.shopId === shopB.shopId)).toBe(true);
  });
});
