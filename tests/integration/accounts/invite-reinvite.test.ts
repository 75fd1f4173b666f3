import { describe, expect, it } from 'vitest';
import { queueHandlers, defaultDeps } from '@/app/_worker/handlers';
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

describe('a lead who re-invites with a corrected role before the first e-mail went', () => {
  it('sends only the newer invite, and its link makes the account with that role', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    const invited = [];
    for (const role of ['lead', 'apprentice'] as const)
      invited.push(await inviteMember(null, { email: 'corrected@example.test', role }));
    expect(invited).toMatchObject([{ ok: true }, { ok: true }]);
    const [older] = (await listPendingInvites(shop.shopId)).filter((i) => i.role === 'lead');

    const sent: OutgoingMail[] = [];
    const send = async (m: OutgoingMail) => void sent.push(m);
    // pg-boss hands a batch over in no fixed order: the older invite's job runs first here, as
    // it would when its worker is quicker, then the queue is worked as usual.
    await queueHandlers({ ...defaultDeps, send })['invite-email'](
      { shopId: shop.shopId, inviteId: older!.id, inviterName: shop.lead.name },
      { id: 'older-first', retryCount: 0, retryLimit: 3 },
    );
    await drainQueues({ send }, INVITES);

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
