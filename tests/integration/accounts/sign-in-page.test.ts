import { describe, expect, it } from 'vitest';
import SignInPage from '@/app/(auth)/sign-in/page';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';

const open = (next: string) =>
  SignInPage({ params: Promise.resolve({}), searchParams: Promise.resolve({ next }) } as Parameters<
    typeof SignInPage
  >[0]);

describe('the sign-in page for someone already signed in', () => {
  it('sends /sign-in?next=/.//evil.test/x to the board on this site, not to evil.test', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    // Next's redirect digest: NEXT_REDIRECT;<type>;<location>;<status>;
    await expect(open('/.//evil.test/x')).rejects.toMatchObject({
      digest: expect.stringMatching(/^NEXT_REDIRECT;\w+;\/board;/),
    });
  });

  it('still goes back to a page on this site', async () => {
    const shop = await createTestShop();
    await actAs(shop.lead.userId);
    await expect(open('/jobs/./1/wheels/2/run')).rejects.toMatchObject({
      digest: expect.stringMatching(/^NEXT_REDIRECT;\w+;\/jobs\/1\/wheels\/2\/run;/),
    });
  });
});
