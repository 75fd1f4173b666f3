import { eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { POST } from '@/app/api/wheels/[wheelId]/events/route';
import { getDb } from '@/db';
import { wheelRunEvents } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import type * as OneStatement from '@/features/runner/server/one-statement-save';
import { saveWheelBatchForSession } from '@/features/runner/server/one-statement-save';
import type * as SaveEvents from '@/features/runner/server/save-events';
import { saveWheelBatch } from '@/features/runner/server/save-events';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';
import { clockedConfirmations } from '@/tests/helpers/wheel-events-fixtures';

// Both save paths stay real; the spies only say which one answered.
vi.mock('@/features/runner/server/save-events', async (importOriginal) => {
  const real = await importOriginal<typeof SaveEvents>();
  return { ...real, saveWheelBatch: vi.fn(real.saveWheelBatch) };
});
vi.mock('@/features/runner/server/one-statement-save', async (importOriginal) => {
  const real = await importOriginal<typeof OneStatement>();
  return { ...real, saveWheelBatchForSession: vi.fn(real.saveWheelBatchForSession) };
});

/** POST /api/wheels/:id/events, the runner's save path, at the HTTP level. */
type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, jobId: string, wheelId: string, technician: string;

beforeEach(async () => {
  shop = await createTestShop();
  jobId = (await createRecords(shop.lead, shop.technician.userId)).job.id;
  wheelId = (await getJob(shop.shopId, jobId)).wheels[0]!.id;
  technician = await cookieFor(shop.technician.userId);
  vi.mocked(saveWheelBatch).mockClear();
  vi.mocked(saveWheelBatchForSession).mockClear();
});

const confirm = clockedConfirmations();
const post = (
  body: unknown,
  init: { cookie?: string; origin?: string | null; wheel?: string } = {},
) => {
  const wheel = init.wheel ?? wheelId;
  return POST(
    apiRequest(`/api/wheels/${wheel}/events`, {
      method: 'POST',
      cookie: init.cookie,
      origin: init.origin,
      body,
    }),
    params({ wheelId: wheel }),
  );
};
const stored = async () =>
  (
    await getDb()
      .select({ clientId: wheelRunEvents.clientId })
      .from(wheelRunEvents)
      .where(eq(wheelRunEvents.wheelId, wheelId))
  ).map((r) => r.clientId);

describe('POST /api/wheels/:id/events', () => {
  it('signed out: 401 in the error shape, nothing stored', async () => {
    const res = await post({ events: [confirm(1)] });
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({
      error: { code: 'unauthenticated', message: expect.any(String) },
    });
    expect(await stored()).toEqual([]);
  });

  it("another shop's wheel and a malformed id: 404; an apprentice without clearance: 403", async () => {
    const other = await createTestShop('Other');
    const theirs = await post(
      { events: [confirm(1)] },
      { cookie: await cookieFor(other.lead.userId) },
    );
    expect(theirs.status).toBe(404);
    expect(await theirs.json()).toMatchObject({ error: { code: 'not_found' } });
    expect((await post({ events: [confirm(1)] }, { cookie: technician, wheel: 'x' })).status).toBe(
      404,
    );
    const apprentice = await post(
      { events: [confirm(1)] },
      { cookie: await cookieFor(shop.apprentice.userId) },
    );
    expect(apprentice.status).toBe(403);
    expect(await apprentice.json()).toMatchObject({ error: { code: 'forbidden' } });
    expect(await stored()).toEqual([]);
  });

  it('a write from another origin, or with no Origin, is refused even with a good session', async () => {
    // The wheel is started, so a plain bolt would take the quick path: the origin check comes first.
    expect((await post({ events: [confirm(1)] }, { cookie: technician })).status).toBe(200);
    for (const origin of ['https://evil.example', null]) {
      const res = await post({ events: [confirm(2)] }, { cookie: technician, origin });
      expect(res.status).toBe(403);
      // Its own code: the outbox keeps the batch and retries (post-events.ts), unlike a forbidden.
      expect(await res.json()).toMatchObject({ error: { code: 'cross_origin' } });
    }
    expect(await stored()).toHaveLength(1);
  });

  it('a bad body: 400 with its fields; not JSON: 400; over the cap: 413 — after the session check', async () => {
    const empty = await post({ events: [] }, { cookie: technician });
    expect(empty.status).toBe(400);
    expect(await empty.json()).toEqual({
      error: {
        code: 'invalid',
        message: expect.any(String),
        fields: { events: [expect.any(String)] },
      },
    });
    expect((await post('{oops', { cookie: technician })).status).toBe(400);
    const huge = { events: [{ ...confirm(1), note: 'x'.repeat(300 * 1024) }] };
    expect((await post(huge, { cookie: technician })).status).toBe(413);
    // Signed out, the same bodies are answered 401: nobody learns how a body is judged.
    expect((await post('{oops')).status).toBe(401);
    expect((await post(huge)).status).toBe(401);
    expect(await stored()).toEqual([]);
  });

  it('stores each client id once: a replay answers duplicates', async () => {
    const batch = [confirm(1), confirm(13)];
    for (const expected of [
      { saved: 2, duplicates: 0, refused: [] },
      { saved: 0, duplicates: 2, refused: [] },
    ]) {
      const res = await post({ events: batch }, { cookie: technician });
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ data: expected });
    }
    expect((await stored()).sort()).toEqual(batch.map((e) => e.clientId).sort());
  });

  it('refuses a bad event alone, by its place in the batch, and stores the rest', async () => {
    const good = confirm(1);
    const offRing = confirm(99);
    const res = await post({ events: [offRing, good] }, { cookie: technician });
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({
      data: {
        saved: 1,
        duplicates: 0,
        refused: [{ index: 0, clientId: offRing.clientId, message: expect.any(String) }],
      },
    });
    expect(await stored()).toEqual([good.clientId]);
  });

  it('the first event goes the full way (snapshot, job started); a plain bolt after it is stored by the quick statement alone', async () => {
    const first = await post({ events: [confirm(1)] }, { cookie: technician });
    expect(await first.json()).toEqual({ data: { saved: 1, duplicates: 0, refused: [] } });
    expect(saveWheelBatch).toHaveBeenCalledTimes(1);
    expect((await getJob(shop.shopId, jobId)).state).toBe('in_progress');

    vi.mocked(saveWheelBatch).mockClear();
    vi.mocked(saveWheelBatchForSession).mockClear();
    const next = await post({ events: [confirm(2)] }, { cookie: technician });
    expect(next.status).toBe(200);
    expect(await next.json()).toEqual({ data: { saved: 1, duplicates: 0, refused: [] } });
    expect(saveWheelBatchForSession).toHaveBeenCalledTimes(1);
    // The statement checks the route's own permission (apiRoute hands it over).
    expect(vi.mocked(saveWheelBatchForSession).mock.calls[0]?.[1]).toBe('jobs.run');
    expect(saveWheelBatch).not.toHaveBeenCalled();
    expect(await stored()).toHaveLength(2);
  });
});
