import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { sessions, shops, signUpRequests, users } from '@/db/schema';
import { signIn } from '@/features/accounts/actions/sign-in';
import { finishSignUp, signUp } from '@/features/accounts/actions/sign-up';
import { getShopName } from '@/features/accounts/server/shop';
import { createSessionCookie, validateSessionId } from '@/server/auth/session';
import { getShopSettings } from '@/server/shop/settings';
import { accountDelayMs } from '@/server/auth/throttle';
import type { SinkMessage } from '@/server/mail/mailbox';
import { createTestShop, PASSWORD } from '@/tests/helpers/factories';
import { waitForMail } from '@/tests/helpers/mailbox';
import {
  cookieAttributes,
  cookieValue,
  resetNextRequest,
  setRequestAddress,
} from '@/tests/helpers/next-request';
import { INTEGRATION_SINK } from '@/tests/helpers/test-services';

const SESSION = 'ringpass_session';
// The database keeps the SHA-256 of the cookie's token (hex), never the token.
const storedSessionId = (token: string) => createHash('sha256').update(token).digest('hex');

async function expectRedirect(call: Promise<unknown>, to: string) {
  await expect(call).rejects.toMatchObject({ digest: expect.stringContaining(to) });
}

const signUpToken = (m: SinkMessage) => /\/sign-up\/([A-Za-z0-9_-]+)/.exec(m.text)?.[1] ?? '';

describe('sign-up', () => {
  it('sends a link; the link creates the shop and its first lead and signs them in with an httpOnly Lax cookie', async () => {
    resetNextRequest();
    expect(
      await signUp(null, {
        shopName: 'Gravel Pit Tires',
        name: 'Rosa Vent',
        email: 'Rosa@Gravel.test',
        password: 'a long enough password',
      }),
    ).toEqual({ ok: true, data: { email: 'rosa@gravel.test' } });
    expect(await getDb().$count(users, eq(users.email, 'rosa@gravel.test'))).toBe(0);
    const mail = await waitForMail(INTEGRATION_SINK.dir, 'rosa@gravel.test');
    expect(mail.subject).toBe('Finish creating Gravel Pit Tires on Ringpass');
    const token = signUpToken(mail);
    expect(await getDb().$count(signUpRequests, eq(signUpRequests.tokenHash, token))).toBe(0); // only the hash is stored

    await expectRedirect(finishSignUp(null, { token }), '/board');
    const [user] = await getDb().select().from(users).where(eq(users.email, 'rosa@gravel.test'));
    expect(user).toMatchObject({ role: 'lead', name: 'Rosa Vent' });
    expect(user!.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(cookieValue(SESSION)).toBeTruthy();
    expect(cookieAttributes(SESSION)).toMatchObject({ httpOnly: true, sameSite: 'lax' });
    resetNextRequest();
    expect(await finishSignUp(null, { token })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/expired or was already used/),
    });
  });

  it("the shop made from the link keeps what the form sent, the browser's time zone included", async () => {
    resetNextRequest();
    await signUp(null, {
      shopName: 'Mesa Bead Works',
      name: 'Mo Mesa',
      email: 'mo@mesa.test',
      password: 'a long enough password',
      timeZone: 'America/Denver',
    });
    await expectRedirect(
      finishSignUp(null, {
        token: signUpToken(await waitForMail(INTEGRATION_SINK.dir, 'mo@mesa.test')),
      }),
      '/board',
    );
    const [user] = await getDb()
      .select({ shopId: users.shopId })
      .from(users)
      .where(eq(users.email, 'mo@mesa.test'));
    expect((await getShopSettings(user!.shopId)).timeZone).toBe('America/Denver');
    expect(await getShopName(user!.shopId)).toBe('Mesa Bead Works');
  });

  it('refuses bad input field by field and creates nothing', async () => {
    const before = await getDb().$count(users);
    const result = await signUp(null, {
      shopName: '',
      name: '',
      email: 'not-an-email',
      password: 'short',
    });
    expect(result).toMatchObject({
      ok: false,
      fieldErrors: {
        shopName: [expect.any(String)],
        name: ['Enter a name.'],
        email: [expect.stringMatching(/valid e-mail/)],
        password: ['Use at least 12 characters.'],
      },
    });
    expect(await getDb().$count(users)).toBe(before);
  });

  it('answers an address that already has an account exactly as a new one, and tells its owner by e-mail', async () => {
    const shop = await createTestShop();
    const form = (email: string) => ({
      shopName: 'Copy',
      name: 'X',
      email,
      password: 'a long enough password',
    });
    const startedTaken = Date.now();
    const taken = await signUp(null, form(shop.lead.email));
    const takenMs = Date.now() - startedTaken;
    const startedFresh = Date.now();
    const fresh = await signUp(null, form('brand-new@gravel.test'));
    const freshMs = Date.now() - startedFresh;
    expect(taken).toEqual({ ok: true, data: { email: shop.lead.email } });
    expect(fresh).toEqual({ ok: true, data: { email: 'brand-new@gravel.test' } });
    // Both hash the password; the difference is one insert, far below the hash's cost.
    expect(Math.abs(takenMs - freshMs)).toBeLessThan(Math.max(takenMs, freshMs) * 0.75 + 50);

    const notice = await waitForMail(INTEGRATION_SINK.dir, shop.lead.email);
    expect(notice.subject).toBe('Someone tried to create a Ringpass shop with your address');
    expect(signUpToken(notice)).toBe('');
    expect(notice.shopId).toBe(shop.shopId);
    expect(await getDb().$count(shops, eq(shops.name, 'Copy'))).toBe(0);
  });
});

describe('sign-in', () => {
  it('signs in with the right password; a technician lands on their wheels, an apprentice on practice, a lead on the board', async () => {
    const shop = await createTestShop();
    resetNextRequest();
    await expectRedirect(
      signIn(null, { email: shop.apprentice.email, password: PASSWORD }),
      '/practice',
    );
    resetNextRequest();
    await expectRedirect(signIn(null, { email: shop.lead.email, password: PASSWORD }), '/board');
    resetNextRequest();
    await expectRedirect(
      signIn(null, { email: shop.technician.email, password: PASSWORD }),
      '/my-wheels',
    );
    expect((await validateSessionId(cookieValue(SESSION)))?.member).toMatchObject({
      userId: shop.technician.userId,
      role: 'technician',
    });
  });

  it('goes back to the page the session ended on, and never to another site', async () => {
    const shop = await createTestShop();
    resetNextRequest();
    await expectRedirect(
      signIn(null, { email: shop.lead.email, password: PASSWORD, next: '/jobs/1/wheels/2/run' }),
      '/jobs/1/wheels/2/run',
    );
    resetNextRequest();
    await expectRedirect(
      signIn(null, { email: shop.lead.email, password: PASSWORD, next: '//evil.example/board' }),
      ';/board;',
    );
  });

  it('says "wrong e-mail or password" for both a wrong password and an unknown address', async () => {
    const shop = await createTestShop();
    resetNextRequest('198.51.100.1');
    expect(await signIn(null, { email: shop.lead.email, password: 'nope' })).toMatchObject({
      ok: false,
      message: 'Wrong e-mail or password.',
    });
    expect(await signIn(null, { email: 'nobody@nowhere.test', password: 'nope' })).toMatchObject({
      ok: false,
      message: 'Wrong e-mail or password.',
    });
    expect(cookieValue(SESSION)).toBeUndefined();
  });

  it('refuses the sixth wrong password from one address, even with the right password; the owner elsewhere still gets in, only slowed', async () => {
    const shop = await createTestShop();
    resetNextRequest('198.51.100.11');
    for (let i = 1; i <= 5; i++) {
      expect(await signIn(null, { email: shop.lead.email, password: `wrong-${i}` })).toMatchObject({
        message: 'Wrong e-mail or password.',
      });
    }
    expect(await signIn(null, { email: shop.lead.email, password: 'wrong-6' })).toMatchObject({
      ok: false,
      code: 'rate_limited',
      message: expect.stringMatching(/Try again later/),
    });
    expect(await signIn(null, { email: shop.lead.email, password: PASSWORD })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/Try again later/),
    });

    setRequestAddress('198.51.100.99');
    const started = Date.now();
    await expectRedirect(signIn(null, { email: shop.lead.email, password: PASSWORD }), '/board');
    expect(Date.now() - started).toBeGreaterThanOrEqual(accountDelayMs(5) - 10);
  });

  it('a parallel burst of 20 wrong passwords from one address gets at most 5 answered', async () => {
    const shop = await createTestShop();
    resetNextRequest('198.51.100.40');
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        signIn(null, { email: shop.technician.email, password: `burst-${i}` }),
      ),
    );
    const checked = results.filter(
      (r) => (r as { message?: string }).message === 'Wrong e-mail or password.',
    );
    const refused = results.filter((r) =>
      /Try again later/.test((r as { message?: string }).message ?? ''),
    );
    expect(checked.length).toBeLessThanOrEqual(5);
    expect(checked.length + refused.length).toBe(20);
  });

  it('wrong passwords for one account from many addresses slow it down but never lock it', async () => {
    const shop = await createTestShop();
    for (let i = 1; i <= 7; i++) {
      resetNextRequest(`198.51.100.${60 + i}`);
      expect(
        await signIn(null, { email: shop.apprentice.email, password: `spray-${i}` }),
      ).toMatchObject({ message: 'Wrong e-mail or password.' });
    }
    resetNextRequest('198.51.100.90');
    const started = Date.now();
    await expectRedirect(
      signIn(null, { email: shop.apprentice.email, password: PASSWORD }),
      '/practice',
    );
    expect(Date.now() - started).toBeGreaterThanOrEqual(accountDelayMs(7) - 10);
  });

  it('a success ends the run of failures', async () => {
    const shop = await createTestShop();
    resetNextRequest('192.0.2.50');
    for (let i = 0; i < 4; i++) await signIn(null, { email: shop.lead.email, password: 'wrong' });
    await expectRedirect(signIn(null, { email: shop.lead.email, password: PASSWORD }), '/board');
    for (let i = 0; i < 4; i++)
      expect(await signIn(null, { email: shop.lead.email, password: 'wrong' })).toMatchObject({
        message: 'Wrong e-mail or password.',
      });
  });

  it('throttles one address trying many accounts', async () => {
    resetNextRequest('192.0.2.77');
    let last: unknown;
    for (let i = 0; i < 31; i++)
      last = await signIn(null, { email: `guess-${i}@nowhere.test`, password: 'x' });
    expect(last).toMatchObject({ message: expect.stringMatching(/Try again later/) });
  });
});

describe('sessions', () => {
  it('end at their absolute lifetime however active they are', async () => {
    const shop = await createTestShop();
    const cookie = await createSessionCookie(shop.lead.userId);
    expect(await validateSessionId(cookie.value)).not.toBeNull();
    const id = storedSessionId(cookie.value);
    await getDb()
      .update(sessions)
      .set({ absoluteExpiresAt: new Date(Date.now() - 1000) })
      .where(eq(sessions.id, id));
    expect(await validateSessionId(cookie.value)).toBeNull();
    expect(await getDb().$count(sessions, eq(sessions.id, id))).toBe(0);
  });

  it('a removed member is signed out and cannot sign in', async () => {
    const shop = await createTestShop();
    const cookie = await createSessionCookie(shop.technician.userId);
    await getDb()
      .update(users)
      .set({ removedAt: new Date() })
      .where(eq(users.id, shop.technician.userId));
    expect(await validateSessionId(cookie.value)).toBeNull();
    resetNextRequest('192.0.2.90');
    expect(await signIn(null, { email: shop.technician.email, password: PASSWORD })).toMatchObject({
      ok: false,
    });
  });
});
