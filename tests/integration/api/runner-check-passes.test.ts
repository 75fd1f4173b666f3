import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { POST as CREATE_JOB } from '@/app/api/jobs/route';
import { GET } from '@/app/api/wheels/[wheelId]/events/route';
import { POST as SUBMIT } from '@/app/api/wheels/[wheelId]/submit/route';
import { getDb } from '@/db';
import { jobWheels, wheelPhotos, wheelRunEvents, wrenches } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, fourWheels, verifiedAt } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop,
  wheelId: string,
  jobId: string,
  wrenchId: string,
  specId: string,
  records: Awaited<ReturnType<typeof createRecords>>;

beforeEach(async () => {
  shop = await createTestShop();
  records = await createRecords(shop.lead, shop.technician.userId);
  jobId = records.job.id;
  wrenchId = records.wrench.id;
  specId = records.spec.id;
  wheelId = (await getJob(shop.shopId, jobId)).wheels[0]!.id;
});

let t = 0;
const base = Date.now() - 60 * 60 * 1000;
const at = () => new Date(base + 1000 * t++).toISOString();
const confirm = (bolt: number, pass: number, extra: Record<string, unknown> = {}) => ({
  type: 'bolt_confirmed',
  payload: { pass, bolt, ...extra },
  clientId: randomUUID(),
  clientAt: at(),
});
const post = async (events: unknown[]) => {
  await actAs(shop.technician.userId);
  return postToWheelEvents(null, { wheelId, events } as Parameters<typeof postToWheelEvents>[1]);
};
const cycles = async () =>
  (
    await getDb()
      .select({ n: wrenches.cyclesSinceCalibration })
      .from(wrenches)
      .where(eq(wrenches.id, wrenchId))
  )[0]!.n;
const state = async () => {
  const res = await GET(
    apiRequest(`/api/wheels/${wheelId}/events`, {
      cookie: await cookieFor(shop.technician.userId),
    }),
    params({ wheelId }),
  );
  return (
    (await res.json()) as {
      data: {
        state: {
          passes: { index: number; added: boolean; confirmed: number[] }[];
          flagged: string | null;
          flaggedBolts: unknown[];
        };
      };
    }
  ).data.state;
};
// The test spec: 24 bolts, passes 30/70/100 % and a check pass, so the plan has 4 passes.
const CHECK = 4;

describe('a bolt that stops the wheel (bolt_flagged)', () => {
  it('flags the wheel for the lead, shows on the job card and blocks submit', async () => {
    expect(
      await post([
        confirm(1, 1),
        {
          type: 'bolt_flagged',
          payload: { bolt: 13, pass: 1, problem: 'stripped' },
          clientId: randomUUID(),
          clientAt: at(),
        },
      ]),
    ).toMatchObject({ ok: true, data: { saved: 2, refused: [] } });
    const wheel = (await getJob(shop.shopId, jobId)).wheels.find((w) => w.id === wheelId)!;
    expect(wheel.flaggedReason).toBe('Bolt 13 (pass 1): stripped thread');
    expect(await state()).toMatchObject({
      flagged: 'Bolt 13 (pass 1): stripped thread',
      flaggedBolts: [{ bolt: 13, pass: 1, problem: 'stripped', note: '' }],
    });
    const res = await SUBMIT(
      apiRequest(`/api/wheels/${wheelId}/submit`, {
        method: 'POST',
        cookie: await cookieFor(shop.technician.userId),
      }),
      params({ wheelId }),
    );
    expect(res.status).toBe(409);
    const body = (await res.json()) as { error: { fields: { submit: string[] } } };
    expect(body.error.fields.submit[0]).toBe(
      'A bolt stopped the wheel: Bolt 13 (pass 1): stripped thread. A lead must look at this wheel.',
    );
  });

  it('keeps a photo of this wheel with the flag, and drops an id that is not one (the flag itself still stops the wheel)', async () => {
    const [photo] = await getDb()
      .insert(wheelPhotos)
      .values({
        shopId: shop.shopId,
        jobId,
        wheelId,
        kind: 'other',
        note: 'bolt 5',
        fileKey: `k-${randomUUID()}`,
        url: 'https://files.test/x.jpg',
        bytes: 10,
        mime: 'image/jpeg',
        uploadedById: shop.technician.userId,
      })
      .returning({ id: wheelPhotos.id });
    const mine = {
      type: 'bolt_flagged',
      payload: { bolt: 5, problem: 'snapped', photoId: photo!.id },
      clientId: randomUUID(),
      clientAt: at(),
    };
    const foreign = {
      type: 'bolt_flagged',
      payload: { bolt: 6, problem: 'spins', photoId: randomUUID() },
      clientId: randomUUID(),
      clientAt: at(),
    };
    expect(await post([mine, foreign])).toMatchObject({
      ok: true,
      data: { saved: 2, refused: [] },
    });
    const rows = await getDb()
      .select({ clientId: wheelRunEvents.clientId, payload: wheelRunEvents.payload })
      .from(wheelRunEvents)
      .where(eq(wheelRunEvents.wheelId, wheelId));
    expect(rows.find((r) => r.clientId === mine.clientId)!.payload).toEqual(mine.payload);
    expect(rows.find((r) => r.clientId === foreign.clientId)!.payload).toEqual({
      bolt: 6,
      problem: 'spins',
    });
    expect((await state()).flaggedBolts).toHaveLength(2);
  });

  it('"other" without a note is refused alone and flags nothing', async () => {
    const result = await post([
      confirm(1, 1),
      {
        type: 'bolt_flagged',
        payload: { bolt: 2, problem: 'other' },
        clientId: randomUUID(),
        clientAt: at(),
      },
    ]);
    expect(result).toMatchObject({
      ok: true,
      data: {
        saved: 1,
        refused: [
          { index: 1, fieldErrors: { 'payload.note': ['Say what is wrong with the bolt.'] } },
        ],
      },
    });
    const [w] = await getDb()
      .select({ flaggedReason: jobWheels.flaggedReason })
      .from(jobWheels)
      .where(eq(jobWheels.id, wheelId));
    expect(w!.flaggedReason).toBeNull();
  });
});

describe('wrench cycles from bolt confirmations', () => {
  it('each stored confirmation adds one cycle to its wrench, exactly once however often the batch is replayed', async () => {
    expect(await cycles()).toBeNull();
    await verifiedAt(shop.technician, wrenchId, new Date(base - 1000));
    const batch = [1, 13, 7].map((b) => confirm(b, 1, { wrenchId }));
    await post(batch); // the first event: the full path (snapshot)
    expect(await cycles()).toBe(3);
    await post(batch); // a replay
    expect(await cycles()).toBe(3);
    const more = [19, 4].map((b) => confirm(b, 1, { wrenchId }));
    await post(more); // the one-statement path
    await post(more);
    expect(await cycles()).toBe(5);
    await post([batch[0], confirm(16, 1, { wrenchId }), confirm(99, 1, { wrenchId })]); // a replay, a new one and a refusal
    expect(await cycles()).toBe(6);
    await post([confirm(10, 1)]); // an older phone sends no wrench: no cycle, nothing else touched
    expect(await cycles()).toBe(6);
  });

  it("another shop's wrench id counts nothing there", async () => {
    const other = await createTestShop('Other');
    const theirs = (await createRecords(other.lead, other.technician.userId)).wrench.id;
    await post([confirm(1, 1, { wrenchId: theirs })]);
    const [w] = await getDb()
      .select({ n: wrenches.cyclesSinceCalibration })
      .from(wrenches)
      .where(and(eq(wrenches.id, theirs)));
    expect(w!.n).toBeNull();
  });
});

describe('check passes past the plan (added when a bolt turned on the check pass before)', () => {
  it('pass 5 is refused while no bolt turned on the check pass, and taken once one did', async () => {
    const refused = await post([confirm(1, CHECK), confirm(2, CHECK + 1)]);
    expect(refused).toMatchObject({
      ok: true,
      data: {
        saved: 1,
        refused: [
          {
            index: 1,
            message: "Pass 5 is not in this wheel's plan.",
            fieldErrors: {
              'payload.pass': [
                'A check pass is only added after a bolt turned on pass 4; none did.',
              ],
            },
          },
        ],
      },
    });
    // Stored earlier: a bolt of pass 4 turned, so pass 5 is due.
    await post([confirm(3, CHECK, { turned: true })]);
    expect(await post([confirm(1, CHECK + 1)])).toMatchObject({
      ok: true,
      data: { saved: 1, refused: [] },
    });
    // Pass 6 needs a turned bolt on pass 5; in the same batch, before it, is enough.
    expect(
      await post([confirm(2, CHECK + 1, { turned: true }), confirm(1, CHECK + 2)]),
    ).toMatchObject({ ok: true, data: { saved: 2, refused: [] } });
    const rows = await getDb()
      .select({ payload: wheelRunEvents.payload })
      .from(wheelRunEvents)
      .where(eq(wheelRunEvents.wheelId, wheelId));
    const added = rows
      .map((r) => r.payload as { pass: number; target: { value: number; unit: string } })
      .filter((p) => p.pass > CHECK);
    // An added check pass is stored with the check pass's target: the spec's 12 lbf-ft.
    expect(added.map((p) => p.target)).toEqual([
      { value: 12, unit: 'lbf-ft' },
      { value: 12, unit: 'lbf-ft' },
      { value: 12, unit: 'lbf-ft' },
    ]);
  });

  it("a wrench chosen for an added check pass goes through the same gate as the check pass's (an unverified wrench is refused)", async () => {
    await post([confirm(3, CHECK, { turned: true })]);
    const chosen = {
      type: 'wrench_chosen',
      payload: { pass: CHECK + 1, wrenchId },
      clientId: randomUUID(),
      clientAt: at(),
    };
    expect(await post([chosen])).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          {
            index: 0,
            message: expect.stringMatching(/^Test click 20–200 in-lb may not be used for pass 5: /),
          },
        ],
      },
    });
  });

  it('a bolt still turning on the tenth check pass (pass 13 of a 4-pass plan) stops the wheel for a lead', async () => {
    const laps = Array.from({ length: 10 }, (_, k) => confirm(1, CHECK + k, { turned: true }));
    expect(await post(laps)).toMatchObject({ ok: true, data: { saved: 10, refused: [] } });
    const [w] = await getDb()
      .select({ flaggedReason: jobWheels.flaggedReason })
      .from(jobWheels)
      .where(eq(jobWheels.id, wheelId));
    expect(w!.flaggedReason).toBe('Bolt 1 still turned on check pass 13, the last one allowed.');
  });

  it('never past ten check passes in all: pass 14 of a 4-pass plan is refused as no such pass', async () => {
    expect(await post([confirm(1, 14)])).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          {
            index: 0,
            message: "Pass 14 is not in this wheel's plan.",
            fieldErrors: { 'payload.pass': ['No such pass.'] },
          },
        ],
      },
    });
  });
});

describe('job intake: one wheel of an axle', () => {
  it('POST /api/jobs saves the job and answers it with a warning naming the missing wheel', async () => {
    const wheels = fourWheels(specId).filter((w) => w.position !== 'RF');
    const body = {
      customerId: records.customer.id,
      vehicleId: records.vehicle.id,
      wheels,
      dismount: true,
      reinstall: false,
      assigneeId: '',
      notes: '',
      acceptAxleMismatch: false,
    };
    const res = await CREATE_JOB(
      apiRequest('/api/jobs', { method: 'POST', cookie: await cookieFor(shop.lead.userId), body }),
      params({}),
    );
    expect(res.status).toBe(201);
    const { data } = (await res.json()) as { data: { wheels: unknown[]; warnings: string[] } };
    expect(data.wheels).toHaveLength(3);
    expect(data.warnings).toEqual([
      expect.stringMatching(/^Front axle: only LF is on this job card, not RF\./),
    ]);
    expect((await getJob(shop.shopId, jobId)).warnings).toEqual([]);
  });
});
