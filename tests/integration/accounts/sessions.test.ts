import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { sessions } from '@/db/schema';
import { signIn } from '@/features/accounts/actions/sign-in';
import { createSessionCookie, validateSessionId } from '@/server/auth/session';
import { env } from '@/server/env.mjs';
import { createTestShop, PASSWORD } from '@/tests/helpers/factories';
import { cookieAttributes, cookieValue, resetNextRequest } from '@/tests/helpers/next-request';

const SESSION = 'ringpass_session';
const sha256Hex = (token: string) => createHash('sha256').update(token).digest('hex');

async function signInFresh(email: string) {
  resetNextRequest('198.51.100.200');
  await expect(signIn(null, { email, password: PASSWORD })).rejects.toMatchObject({
    digest: expect.stringMatching(/;\/(board|my-wheels);/),
  });
  return cookieValue(SESSION)!;
}

describe('sessions are stored as hashes', () => {
  it('the database holds only the SHA-256 of the cookie’s token, never the token', async () => {
    const shop = await createTestShop();
    const token = await signInFresh(shop.lead.email);
    expect(token).toMatch(/^[a-z2-7]{32}$/); // 20 random bytes, base32 lower case
    const rows = await getDb()
      .select({ id: sessions.id })
      .from(sessions)
      .where(eq(sessions.userId, shop.lead.userId));
    expect(rows).toEqual([{ id: sha256Hex(token) }]);
    expect(await getDb().$count(sessions, eq(sessions.id, token))).toBe(0);
  });

  it('a session row copied from the database does not work as a cookie', async () => {
    const shop = await createTestShop();
    const token = await signInFresh(shop.technician.email);
    const [row] = await getDb()
      .select({ id: sessions.id })
      .from(sessions)
      .where(eq(sessions.userId, shop.technician.userId));
    expect(await validateSessionId(row!.id)).toBeNull();
    expect((await validateSessionId(token))?.member).toMatchObject({
      userId: shop.technician.userId,
    });
  });

  it('the cookie lasts as long as the session’s absolute lifetime, not longer', async () => {
    const shop = await createTestShop();
    await signInFresh(shop.lead.email);
    const attributes = cookieAttributes(SESSION) as {
      maxAge: number;
      expires: Date;
      httpOnly: boolean;
    };
    const lifetime = env().SESSION_ABSOLUTE_HOURS * 3600;
    expect(attributes.maxAge).toBeGreaterThan(lifetime - 5);
    expect(attributes.maxAge).toBeLessThanOrEqual(lifetime);
    const [row] = await getDb()
      .select({ absoluteExpiresAt: sessions.absoluteExpiresAt })
      .from(sessions)
      .where(eq(sessions.userId, shop.lead.userId));
    expect(attributes.expires.getTime()).toBe(row!.absoluteExpiresAt.getTime());
  });

  it('an idle session ends; a used one is renewed once half its idle time is gone, up to the absolute end', async () => {
    const shop = await createTestShop();
    const idle = await createSessionCookie(shop.lead.userId);
    await getDb()
      .update(sessions)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(sessions.id, sha256Hex(idle.value)));
    expect(await validateSessionId(idle.value)).toBeNull();

    const used = await createSessionCookie(shop.lead.userId);
    const id = sha256Hex(used.value);
    const soon = new Date(Date.now() + 60 * 60_000);
    await getDb().update(sessions).set({ expiresAt: soon }).where(eq(sessions.id, id));
    expect(await validateSessionId(used.value)).not.toBeNull();
    const [renewed] = await getDb()
      .select({ expiresAt: sessions.expiresAt, absoluteExpiresAt: sessions.absoluteExpiresAt })
      .from(sessions)
      .where(eq(sessions.id, id));
    expect(renewed!.expiresAt.getTime()).toBeGreaterThan(soon.getTime() + 5 * 3_600_000);
    expect(renewed!.expiresAt.getTime()).toBeLessThanOrEqual(renewed!.absoluteExpiresAt.getTime());
  });

  it('a cookie of the wrong shape is refused without a lookup error', async () => {
    for (const bad of ['', 'x', 'A'.repeat(32), `${'a'.repeat(32)}\u0000`, 'a'.repeat(10_000)])
      expect(await validateSessionId(bad)).toBeNull();
  });
});
