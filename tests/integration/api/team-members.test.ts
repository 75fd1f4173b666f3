import { describe, expect, it } from 'vitest';
import {
  GET as getMember,
  DELETE as deleteMember,
  PATCH as patchMember,
} from '@/app/api/team/members/[memberId]/route';
import { GET as listMembers } from '@/app/api/team/members/route';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';

describe('GET /api/team/members', () => {
  it('lists the lead’s own shop only, with no password hashes', async () => {
    const shop = await createTestShop();
    await createTestShop('Other');
    const res = await listMembers(
      apiRequest('/api/team/members', { cookie: await cookieFor(shop.lead.userId) }),
      params({}),
    );
    expect(res.status).toBe(200);
    const body = (await res.json()) as { data: { id: string }[] };
    expect(body.data.map((m) => m.id).sort()).toEqual(
      [shop.lead.userId, shop.technician.userId, shop.apprentice.userId].sort(),
    );
    expect(JSON.stringify(body)).not.toMatch(/argon2|passwordHash/);
  });

  it('401 signed out, 403 for a technician, in the one error shape', async () => {
    const shop = await createTestShop();
    const signedOut = await listMembers(apiRequest('/api/team/members'), params({}));
    expect(signedOut.status).toBe(401);
    expect(await signedOut.json()).toEqual({
      error: { code: 'unauthenticated', message: 'Sign in to continue.' },
    });
    const tech = await listMembers(
      apiRequest('/api/team/members', { cookie: await cookieFor(shop.technician.userId) }),
      params({}),
    );
    expect(tech.status).toBe(403);
    expect(await tech.json()).toMatchObject({ error: { code: 'forbidden' } });
  });
});

describe('/api/team/members/[memberId]', () => {
  it('404 for another shop’s member, and for a malformed id', async () => {
    const shop = await createTestShop();
    const other = await createTestShop('Other');
    const cookie = await cookieFor(shop.lead.userId);
    const res = await getMember(
      apiRequest(`/api/team/members/${other.technician.userId}`, { cookie }),
      params({ memberId: other.technician.userId }),
    );
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({
      error: { code: 'not_found', message: 'That team member was not found.' },
    });
    const bad = await getMember(
      apiRequest('/api/team/members/nope', { cookie }),
      params({ memberId: 'nope' }),
    );
    expect(bad.status).toBe(404);
    const patched = await patchMember(
      apiRequest(`/api/team/members/${other.technician.userId}`, {
        method: 'PATCH',
        cookie,
        body: { role: 'apprentice' },
      }),
      params({ memberId: other.technician.userId }),
    );
    expect(patched.status).toBe(404);
  });

  it('PATCH changes a role; bad input is a 400 with field errors; bad JSON is a 400, never a 500', async () => {
    const shop = await createTestShop();
    const cookie = await cookieFor(shop.lead.userId);
    const id = shop.technician.userId;
    const ok = await patchMember(
      apiRequest(`/api/team/members/${id}`, {
        method: 'PATCH',
        cookie,
        body: { role: 'apprentice' },
      }),
      params({ memberId: id }),
    );
    expect(ok.status).toBe(200);
    expect(await ok.json()).toMatchObject({ data: { id, role: 'apprentice' } });

    const bad = await patchMember(
      apiRequest(`/api/team/members/${id}`, { method: 'PATCH', cookie, body: { role: 'boss' } }),
      params({ memberId: id }),
    );
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({
      error: {
        code: 'invalid',
        fields: { role: ['Choose a role: lead, technician or apprentice.'] },
      },
    });

    const junk = await patchMember(
      apiRequest(`/api/team/members/${id}`, { method: 'PATCH', cookie, body: '{not json' }),
      params({ memberId: id }),
    );
    expect(junk.status).toBe(400);
    expect(await junk.json()).toMatchObject({
      error: { code: 'invalid', message: 'The request body is not valid JSON.' },
    });
  });

  it('refuses a write from another origin, or with no Origin at all, and changes nothing', async () => {
    const shop = await createTestShop();
    const cookie = await cookieFor(shop.lead.userId);
    const id = shop.technician.userId;
    for (const origin of ['https://evil.example', null]) {
      const res = await patchMember(
        apiRequest(`/api/team/members/${id}`, {
          method: 'PATCH',
          cookie,
          origin,
          body: { role: 'lead' },
        }),
        params({ memberId: id }),
      );
      expect(res.status).toBe(403);
      expect(await res.json()).toMatchObject({
        error: { code: 'cross_origin', message: expect.stringMatching(/Cross-origin/) },
      });
    }
    const after = await getMember(
      apiRequest(`/api/team/members/${id}`, { cookie }),
      params({ memberId: id }),
    );
    expect(await after.json()).toMatchObject({ data: { role: 'technician' } });
  });

  it('DELETE removes a member (204); the same lead then gets 404 for them', async () => {
    const shop = await createTestShop();
    const cookie = await cookieFor(shop.lead.userId);
    const id = shop.apprentice.userId;
    const res = await deleteMember(
      apiRequest(`/api/team/members/${id}`, { method: 'DELETE', cookie }),
      params({ memberId: id }),
    );
    expect(res.status).toBe(204);
    const again = await getMember(
      apiRequest(`/api/team/members/${id}`, { cookie }),
      params({ memberId: id }),
    );
    expect(again.status).toBe(404);
  });
});
