import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { PATCH as patchMember } from '@/app/api/team/members/[memberId]/route';
import { getDb } from '@/db';
import { users } from '@/db/schema';
import { cookieFor, createTestShop, params } from '@/tests/helpers/factories';

// A body over the API's 256 kB cap is refused with 413 in the one error shape, and nothing changes,
// whether it declares its length or streams in chunks without one.
const LIMIT = 256 * 1024;

function patchRequest(cookie: string, body: string, declareLength: boolean) {
  const headers = new Headers({
    host: '127.0.0.1:3000',
    origin: 'http://127.0.0.1:3000',
    'content-type': 'application/json',
    cookie,
  });
  if (declareLength) {
    return new Request('http://127.0.0.1:3000/api/team/members/x', {
      method: 'PATCH',
      headers,
      body,
    });
  }
  const bytes = new TextEncoder().encode(body);
  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      for (let at = 0; at < bytes.length; at += 16 * 1024)
        controller.enqueue(bytes.slice(at, at + 16 * 1024));
      controller.close();
    },
  });
  return new Request('http://127.0.0.1:3000/api/team/members/x', {
    method: 'PATCH',
    headers,
    body: stream,
    duplex: 'half',
  } as RequestInit);
}

async function roleOf(userId: string) {
  const [row] = await getDb().select({ role: users.role }).from(users).where(eq(users.id, userId));
  return row?.role;
}

describe('JSON body cap on the API', () => {
  for (const declareLength of [true, false]) {
    it(`answers 413 too_large over 256 kB (${declareLength ? 'Content-Length' : 'chunked'}) and changes nothing`, async () => {
      const shop = await createTestShop();
      const cookie = await cookieFor(shop.lead.userId);
      const id = shop.technician.userId;
      const huge = JSON.stringify({ role: 'apprentice', note: 'x'.repeat(LIMIT) });
      const res = await patchMember(
        patchRequest(cookie, huge, declareLength),
        params({ memberId: id }),
      );
      expect(res.status).toBe(413);
      expect(await res.json()).toEqual({
        error: { code: 'too_large', message: 'The request body is larger than 256 kB.' },
      });
      expect(await roleOf(id)).toBe('technician');
    });
  }

  it('a body just under the cap is read as usual', async () => {
    const shop = await createTestShop();
    const cookie = await cookieFor(shop.lead.userId);
    const id = shop.technician.userId;
    const body = JSON.stringify({ role: 'apprentice', note: 'x'.repeat(LIMIT - 100) });
    const res = await patchMember(patchRequest(cookie, body, true), params({ memberId: id }));
    expect(res.status).not.toBe(413);
    expect(res.status).toBeLessThan(500);
  });
});
