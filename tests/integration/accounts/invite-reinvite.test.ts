import { describe, expect, it } from 'vitest';
import { inviteMember } from '@/features/accounts/actions/invite-member';
import {
  acceptInvite,
  findUsableInvite,
  listPendingInvites,
} from '@/features/accounts/server/invites';
import type { OutgoingMail } from '@/server/mail/mailer';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { drainQueues } from '@/tests/helpers/queue';

const INVITES = { names: ['invite-email' as const], ignoreStartAfter: true };
const linkIn = (m: OutgoingMail) => /\/invite\/([A-Za-z0-9_-]+)/.exec(m.text)?.[1] ?? '';

describe('a lead who re-invites before the first e-mail went', () => {
  it('sends only the newer invite, whose role is the one that works', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    await inviteMember(null, { email: 'corrected@example.test', role: 'lead' });
    await inviteMember(null, { email: 'corrected@example.test', role: 'apprentice' });

    const sent: OutgoingMail[] = [];
    await drainQueues({ send: async (m) => void sent.push(m) }, INVITES);

    const toThem = sent.filter((m) => m.to === 'corrected@example.test');
    expect(toThem).toHaveLength(1);
    expect(await findUsableInvite(linkIn(toThem[0]!))).toMatchObject({ role: 'apprentice' });
    expect((await listPendingInvites(shop.shopId)).map((i) => i.role)).toEqual(['apprentice']);
    expect(
      await acceptInvite({
        token: linkIn(toThem[0]!),
        name: 'Corra Vance',
        password: 'a long enough passphrase 42',
      }),
    ).toMatchObject({ role: 'apprentice' });
  });
});
