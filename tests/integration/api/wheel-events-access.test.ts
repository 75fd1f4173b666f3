import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { POST } from '@/app/api/wheels/[wheelId]/events/route';
import { getDb } from '@/db';
import { jobs, practiceClearances, users, wheelRunEvents } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';
import { addTechnician } from '@/tests/helpers/wheel-events-fixtures';

/**
 * Who may save a wheel's events (POST /api/wheels/:id/events), beyond the role table in
 * records-access.test.ts. Each person is tried on a wheel not yet started (the full path decides:
 * assertMayRun) and on a started one (the one-statement save decides first: its own role rule and
 * liveMemberSql's clearance and removal checks; a refusal there goes on to the full path).
 */
type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, jobId: string, fresh: string, started: string;

const confirm = (bolt: number) => ({
  type: 'bolt_confirmed',
  payload: { pass: 1, bolt },
  clientId: randomUUID(),
  clientAt: new Date().toISOString(),
});
const post = async (cookie: string, wheelId: string, bolt: number) => {
  const res = await POST(
    apiRequest(`/api/wheels/${wheelId}/events`, {
      method: 'POST',
      cookie,
      body: { events: [confirm(bolt)] },
    }),
    params({ wheelId }),
  );
  return { status: res.status, body: (await res.json()) as { error?: { code: string } } };
};
const stored = async (wheelId: string) =>
  (
    await getDb()
      .select({ id: wheelRunEvents.clientId })
      .from(wheelRunEvents)
      .where(eq(wheelRunEvents.wheelId, wheelId))
  ).length;
/** Both wheels' answers for one person, and what each left stored. */
const onBoth = async (cookie: string) => {
  const before = { fresh: await stored(fresh), started: await stored(started) };
  const full = await post(cookie, fresh, 1);
  const quick = await post(cookie, started, 2);
  return {
    full: full.status,
    quick: quick.status,
    codes: [full.body.error?.code, quick.body.error?.code],
    storedFull: (await stored(fresh)) - before.fresh,
    storedQuick: (await stored(started)) - before.started,
  };
};
const assignTo = (userId: string) =>
  getDb().update(jobs).set({ assigneeId: userId }).where(eq(jobs.id, jobId));

beforeEach(async () => {
  shop = await createTestShop();
  jobId = (await createRecords(shop.lead, shop.technician.userId)).job.id;
  const wheels = (await getJob(shop.shopId, jobId)).wheels;
  fresh = wheels[0]!.id;
  started = wheels[1]!.id;
  // The assignee's first event takes the wheel's snapshot and starts the job.
  const first = await post(await cookieFor(shop.technician.userId), started, 1);
  expect(first.status).toBe(200);
});

describe('POST /api/wheels/:id/events: who may save', () => {
  it('a technician of the same shop not assigned to the card: 403 on both paths, nothing stored', async () => {
    const other = await addTechnician(shop.shopId);
    expect(await onBoth(await cookieFor(other))).toEqual({
      full: 403,
      quick: 403,
      codes: ['forbidden', 'forbidden'],
      storedFull: 0,
      storedQuick: 0,
    });
  });

  it('an apprentice on the card: refused until cleared, stored once cleared', async () => {
    await assignTo(shop.apprentice.userId);
    const cookie = await cookieFor(shop.apprentice.userId);
    expect(await onBoth(cookie)).toMatchObject({ full: 403, quick: 403, storedQuick: 0 });
    await getDb().insert(practiceClearances).values({
      shopId: shop.shopId,
      userId: shop.apprentice.userId,
      clearedById: shop.lead.userId,
    });
    expect(await onBoth(cookie)).toEqual({
      full: 200,
      quick: 200,
      codes: [undefined, undefined],
      storedFull: 1,
      storedQuick: 1,
    });
  });

  it('a cleared apprentice not on the card: 403 on both paths', async () => {
    await getDb().insert(practiceClearances).values({
      shopId: shop.shopId,
      userId: shop.apprentice.userId,
      clearedById: shop.lead.userId,
    });
    expect(await onBoth(await cookieFor(shop.apprentice.userId))).toMatchObject({
      full: 403,
      quick: 403,
      storedFull: 0,
      storedQuick: 0,
    });
  });

  it('the assignee once removed from the shop: 401 on both paths, nothing stored', async () => {
    const cookie = await cookieFor(shop.technician.userId);
    await getDb()
      .update(users)
      .set({ removedAt: new Date() })
      .where(eq(users.id, shop.technician.userId));
    expect(await onBoth(cookie)).toEqual({
      full: 401,
      quick: 401,
      codes: ['unauthenticated', 'unauthenticated'],
      storedFull: 0,
      storedQuick: 0,
    });
  });

  it("another shop's lead: 404 on both paths, nothing stored", async () => {
    const other = await createTestShop('Other');
    expect(await onBoth(await cookieFor(other.lead.userId))).toEqual({
      full: 404,
      quick: 404,
      codes: ['not_found', 'not_found'],
      storedFull: 0,
      storedQuick: 0,
    });
  });
});
