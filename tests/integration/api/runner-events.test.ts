import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { GET } from '@/app/api/wheels/[wheelId]/events/route';
import { POST as SUBMIT } from '@/app/api/wheels/[wheelId]/submit/route';
import { getDb } from '@/db';
import { wheelRunEvents } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs, resetNextRequest } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { addTechnician } from '@/tests/helpers/wheel-events-fixtures';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, wheelId: string, jobId: string;

beforeEach(async () => {
  shop = await createTestShop();
  const r = await createRecords(shop.lead, shop.technician.userId);
  jobId = r.job.id;
  wheelId = (await getJob(shop.shopId, jobId)).wheels[0]!.id;
});

let t = 0;
// Within the server's clock window (a day back): times further off are clamped, see clock-window.ts.
const base = Date.now() - 60 * 60 * 1000;
const confirm = (bolt: number, pass = 1, clientId: string = randomUUID()) => ({
  type: 'bolt_confirmed',
  payload: { pass, bolt },
  clientId,
  clientAt: new Date(base + 1000 * t++).toISOString(),
});
/** The runner's save path as the phone calls it: the route handler, signed in as `userId`. */
const post = async (userId: string | null, events: unknown[], wheel = wheelId) => {
  if (userId) await actAs(userId);
  else resetNextRequest();
  return postToWheelEvents(null, { wheelId: wheel, events } as Parameters<
    typeof postToWheelEvents
  >[1]);
};
const stored = () =>
  getDb()
    .select({ clientId: wheelRunEvents.clientId })
    .from(wheelRunEvents)
    .where(eq(wheelRunEvents.wheelId, wheelId));

describe('the runner save path (POST /api/wheels/:id/events)', () => {
  it('stores each event once however often it is replayed, and starts the job', async () => {
    const batch = [confirm(1), confirm(13)];
    expect(await post(shop.technician.userId, batch)).toEqual({
      ok: true,
      data: { saved: 2, duplicates: 0, refused: [] },
    });
    expect(await post(shop.technician.userId, batch)).toEqual({
      ok: true,
      data: { saved: 0, duplicates: 2, refused: [] },
    });
    expect(await stored()).toHaveLength(2);
    expect((await getJob(shop.shopId, jobId)).state).toBe('in_progress');
    const res = await GET(
      apiRequest(`/api/wheels/${wheelId}/events`, {
        cookie: await cookieFor(shop.technician.userId),
      }),
      params({ wheelId }),
    );
    expect(await res.json()).toMatchObject({
      data: {
        state: {
          passes: [
            expect.objectContaining({ confirmed: [1, 13] }),
            expect.anything(),
            expect.anything(),
            expect.anything(),
          ],
        },
      },
    });
  });

  it("keeps each event's phone on both save paths, returns it to the phone, and still saves an event with none", async () => {
    const phoneA = randomUUID();
    const phoneB = randomUUID();
    // The wheel's first event takes its snapshot, so it goes through the transaction path.
    const first = { ...confirm(1), deviceId: phoneA };
    // Once the snapshot exists, plain confirmations are stored in one statement (the fast path).
    const fast = [{ ...confirm(13), deviceId: phoneB }, confirm(7)];
    expect(await post(shop.technician.userId, [first])).toMatchObject({
      ok: true,
      data: { saved: 1, refused: [] },
    });
    expect(await post(shop.technician.userId, fast)).toMatchObject({
      ok: true,
      data: { saved: 2, refused: [] },
    });
    const rows = await getDb()
      .select({ clientId: wheelRunEvents.clientId, deviceId: wheelRunEvents.deviceId })
      .from(wheelRunEvents)
      .where(eq(wheelRunEvents.wheelId, wheelId));
    expect(Object.fromEntries(rows.map((r) => [r.clientId, r.deviceId]))).toEqual({
      [first.clientId]: phoneA,
      [fast[0]!.clientId]: phoneB,
      [fast[1]!.clientId]: null,
    });
    const res = await GET(
      apiRequest(`/api/wheels/${wheelId}/events`, {
        cookie: await cookieFor(shop.technician.userId),
      }),
      params({ wheelId }),
    );
    const { data } = (await res.json()) as {
      data: { events: { clientId: string; deviceId?: string }[] };
    };
    expect(data.events.map((e) => [e.clientId, e.deviceId])).toEqual([
      [first.clientId, phoneA],
      [fast[0]!.clientId, phoneB],
      [fast[1]!.clientId, undefined],
    ]);
  });

  it('a phone id that is not an id is refused with its field, and the event is not stored', async () => {
    const bad = { ...confirm(1), deviceId: 'phone-1' };
    const result = await post(shop.technician.userId, [bad, confirm(13)]);
    expect(result).toMatchObject({
      ok: true,
      data: {
        saved: 1,
        refused: [
          {
            index: 0,
            clientId: bad.clientId,
            message: 'The phone id is not valid.',
            fieldErrors: { deviceId: ['The phone id is not valid.'] },
          },
        ],
      },
    });
    expect((await stored()).map((r) => r.clientId)).not.toContain(bad.clientId);
  });

  it('a batch mixing a replay with new events stores only the new ones and says so', async () => {
    const a = confirm(1);
    await post(shop.technician.userId, [a]);
    await post(shop.technician.userId, [a]); // the job is in progress from here on
    expect(await post(shop.technician.userId, [a, confirm(13)])).toEqual({
      ok: true,
      data: { saved: 1, duplicates: 1, refused: [] },
    });
    expect(await stored()).toHaveLength(2);
  });

  it('out-of-order replay (a queue that flushed late) ends in the same state as in order', async () => {
    const seq = [1, 13, 7, 19, 4, 16].map((b) => confirm(b));
    await post(shop.technician.userId, [seq[3], seq[5], seq[4]]);
    await post(shop.technician.userId, [seq[0], seq[2], seq[1]]);
    const res = await GET(
      apiRequest(`/api/wheels/${wheelId}/events`, {
        cookie: await cookieFor(shop.technician.userId),
      }),
      params({ wheelId }),
    );
    const { data } = (await res.json()) as {
      data: {
        events: { clientId: string }[];
        state: { passes: { confirmed: number[] }[]; anomalies: unknown[] };
      };
    };
    expect(data.state.passes[0]!.confirmed).toEqual([1, 13, 7, 19, 4, 16]);
    expect(data.state.anomalies).toEqual([]);
    expect(data.events.map((e) => e.clientId)).toEqual(seq.map((e) => e.clientId));
  });

  it('an apprentice, an unassigned technician, signed out, another shop: refused, nothing stored', async () => {
    expect(await post(shop.apprentice.userId, [confirm(1)])).toMatchObject({
      ok: false,
      code: 'forbidden',
      message: 'Your role does not allow this.',
    });
    expect(await post(null, [confirm(1)])).toMatchObject({
      ok: false,
      code: 'unauthenticated',
      message: expect.stringMatching(/Sign in/),
    });
    const other = await createTestShop('Other');
    expect(await post(other.lead.userId, [confirm(1)])).toMatchObject({
      ok: false,
      code: 'not_found',
      message: 'That wheel was not found.',
    });
    // A technician of the same shop who is not the assignee.
    const tech2 = await addTechnician(shop.shopId);
    expect(await post(tech2, [confirm(1)])).toMatchObject({
      ok: false,
      code: 'forbidden',
      message: expect.stringMatching(/assigned to someone else/),
    });
    expect(await stored()).toHaveLength(0);
  });

  it('two devices confirming the same bolts converge without double-counting', async () => {
    await post(shop.technician.userId, [confirm(1), confirm(13)]); // the phone
    await post(shop.lead.userId, [confirm(13), confirm(7)]); // the lead's tablet, bolt 13 again
    const res = await GET(
      apiRequest(`/api/wheels/${wheelId}/events`, { cookie: await cookieFor(shop.lead.userId) }),
      params({ wheelId }),
    );
    const { data } = (await res.json()) as {
      data: { events: unknown[]; state: { passes: { confirmed: number[] }[] } };
    };
    expect(data.events).toHaveLength(4);
    expect(data.state.passes[0]!.confirmed).toEqual([1, 13, 7]);
  });

  it('a lead may run any wheel of the shop', async () => {
    expect(await post(shop.lead.userId, [confirm(1)])).toMatchObject({
      ok: true,
      data: { saved: 1 },
    });
  });

  it('bad events are refused one by one with a message and change nothing', async () => {
    const cases: unknown[][] = [
      [
        {
          type: 'bolt_confirmed',
          payload: { pass: 1, bolt: 99 },
          clientId: randomUUID(),
          clientAt: new Date().toISOString(),
        },
      ],
      [
        {
          type: 'bolt_confirmed',
          payload: { pass: 1, bolt: 30 },
          clientId: randomUUID(),
          clientAt: new Date().toISOString(),
        },
      ],
      [
        {
          type: 'explode',
          payload: {},
          clientId: randomUUID(),
          clientAt: new Date().toISOString(),
        },
      ],
      [
        {
          type: 'bolt_confirmed',
          payload: { pass: 1, bolt: 1 },
          clientId: 'not-a-uuid',
          clientAt: new Date().toISOString(),
        },
      ],
      [
        {
          type: 'step_skipped',
          payload: { step: 'clean', reason: '' },
          clientId: randomUUID(),
          clientAt: new Date().toISOString(),
        },
      ],
    ];
    for (const events of cases) {
      expect(await post(shop.technician.userId, events), JSON.stringify(events)).toMatchObject({
        ok: true,
        data: {
          saved: 0,
          refused: [{ index: 0, message: expect.any(String), fieldErrors: expect.any(Object) }],
        },
      });
    }
    expect(await post(shop.technician.userId, [])).toMatchObject({
      ok: false,
      code: 'invalid',
      fieldErrors: { events: expect.any(Array) },
    });
    expect(await stored()).toHaveLength(0);
  });

  // Values PostgreSQL cannot store (a NUL byte in jsonb, the year 0000, a lone surrogate) used to
  // fail inside the insert as our own error, which the phone retries for ever, stalling its queue.
  it('an event the database could not store is refused alone with its field; the rest of the batch is saved', async () => {
    const nul = {
      type: 'step_done',
      payload: { step: 'clean', checklist: ['holes blown out\u0000'] },
      clientId: randomUUID(),
      clientAt: new Date().toISOString(),
    };
    const yearZero = { ...confirm(2), clientAt: '0000-01-01T00:00:00Z' };
    const surrogate = {
      type: 'inspection_failed',
      payload: { notes: 'cracked ring \ud800' },
      clientId: randomUUID(),
      clientAt: new Date().toISOString(),
    };
    const offRing = confirm(99);
    const good = [confirm(1), confirm(13)];
    const result = await post(shop.technician.userId, [
      good[0],
      nul,
      yearZero,
      surrogate,
      offRing,
      good[1],
    ]);
    expect(result).toMatchObject({ ok: true, data: { saved: 2, duplicates: 0 } });
    const refused = (
      result as {
        data: {
          refused: { index: number; clientId: string; fieldErrors: Record<string, string[]> }[];
        };
      }
    ).data.refused;
    expect(refused.map((r) => r.index)).toEqual([1, 2, 3, 4]);
    expect(refused.map((r) => r.clientId)).toEqual([
      nul.clientId,
      yearZero.clientId,
      surrogate.clientId,
      offRing.clientId,
    ]);
    expect(Object.keys(refused[0]!.fieldErrors)).toEqual(['payload.checklist.0']);
    expect(Object.keys(refused[1]!.fieldErrors)).toEqual(['clientAt']);
    expect(Object.keys(refused[2]!.fieldErrors)).toEqual(['payload.notes']);
    expect(Object.keys(refused[3]!.fieldErrors)).toEqual(['payload.bolt']);
    expect((await stored()).map((r) => r.clientId).sort()).toEqual(
      good.map((e) => e.clientId).sort(),
    );
  });

  it('an event id used for another wheel is not accepted twice (refused alone, the rest stored)', async () => {
    const id = randomUUID();
    await post(shop.technician.userId, [confirm(1, 1, id)]);
    const otherWheel = (await getJob(shop.shopId, jobId)).wheels[1]!.id;
    expect(
      await post(shop.technician.userId, [confirm(1, 1, id), confirm(13)], otherWheel),
    ).toMatchObject({
      ok: true,
      data: {
        saved: 1,
        duplicates: 0,
        refused: [
          expect.objectContaining({
            index: 0,
            clientId: id,
            message: expect.stringMatching(/another wheel/),
          }),
        ],
      },
    });
  });
});

describe('POST /api/wheels/:id/submit', () => {
  it('refuses while steps and bead photos are missing, saying what is missing', async () => {
    await post(shop.technician.userId, [confirm(1)]);
    const res = await SUBMIT(
      apiRequest(`/api/wheels/${wheelId}/submit`, {
        method: 'POST',
        cookie: await cookieFor(shop.technician.userId),
      }),
      params({ wheelId }),
    );
    expect(res.status).toBe(409);
    const body = (await res.json()) as { error: { fields: { submit: string[] } } };
    expect(body.error.fields.submit).toEqual(
      expect.arrayContaining([
        'Step not finished: Safety gate.',
        'Photo missing: seated bead, outer face.',
      ]),
    );
  });
});
