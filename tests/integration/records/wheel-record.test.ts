import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import RunPage from '@/app/(runner)/jobs/[jobId]/wheels/[wheelId]/run/page';
import { GET as EVENTS } from '@/app/api/wheels/[wheelId]/events/route';
import { getDb } from '@/db';
import { jobEvents, jobWheels, refusedRunEvents, wheelRunEvents, wrenches } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import type { RunnerProps } from '@/features/runner/components/runner';
import { specSchema } from '@/features/specs/schemas';
import { updateSpec } from '@/features/specs/server/specs';
import { verificationSchema } from '@/features/tool-crib/schemas';
import { recordVerification } from '@/features/tool-crib/server/wrenches';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, specBody, verifiedAt } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, records: Awaited<ReturnType<typeof createRecords>>, wheelId: string, jobId: string;

beforeEach(async () => {
  shop = await createTestShop();
  records = await createRecords(shop.lead, shop.technician.userId);
  jobId = records.job.id;
  wheelId = (await getJob(shop.shopId, jobId)).wheels[0]!.id;
});

let t = 0;
const at = () => new Date(Date.now() - 30 * 60_000 + 1000 * t++).toISOString();
const ev = (type: string, payload: Record<string, unknown>, clientAt = at()) => ({
  type,
  payload,
  clientId: randomUUID(),
  clientAt,
});
const post = async (userId: string, events: unknown[], wheel = wheelId) => {
  await actAs(userId);
  return postToWheelEvents(null, { wheelId: wheel, events } as Parameters<
    typeof postToWheelEvents
  >[1]);
};
const rows = (wheel = wheelId) =>
  getDb().select().from(wheelRunEvents).where(eq(wheelRunEvents.wheelId, wheel));
const refusedRows = () =>
  getDb().select().from(refusedRunEvents).where(eq(refusedRunEvents.wheelId, wheelId));

describe('snapshot at start', () => {
  it("the first event copies the spec and plan onto the wheel; a later spec edit changes neither the runner's plan nor the stored targets", async () => {
    const first = await post(shop.technician.userId, [ev('bolt_confirmed', { pass: 1, bolt: 1 })]);
    expect(first).toMatchObject({ ok: true, data: { saved: 1 } });
    const [wheel] = await getDb()
      .select({ snapshot: jobWheels.snapshot, startedAt: jobWheels.startedAt })
      .from(jobWheels)
      .where(eq(jobWheels.id, wheelId));
    expect(wheel!.startedAt).toBeInstanceOf(Date);
    expect(wheel!.snapshot).toMatchObject({
      spec: {
        name: 'Test 24-bolt ring',
        boltCount: 24,
        finalTorque: { value: 12, unit: 'lbf-ft' },
        maxBeadSeatPressure: { value: 30, unit: 'psi' },
      },
      plan: {
        passes: [
          { index: 1, target: { value: 3.6, unit: 'lbf-ft' } },
          { index: 2 },
          { index: 3 },
          { index: 4, kind: 'check' },
        ],
      },
    });
    // A lead later changes the spec: 16 bolts, 20 ft-lb, two passes.
    await updateSpec(
      shop.lead,
      records.spec.id,
      specSchema.parse({
        ...specBody,
        boltCount: 16,
        finalTorque: 20,
        passPercents: [50, 100],
        checkPass: false,
      }),
    );
    await post(shop.technician.userId, [
      ev('bolt_confirmed', { pass: 1, bolt: 20 }),
      ev('bolt_confirmed', { pass: 4, bolt: 2 }),
    ]);
    const stored = await rows();
    expect(stored.map((r) => (r.payload as { target: unknown }).target)).toEqual([
      { value: 3.6, unit: 'lbf-ft' },
      { value: 3.6, unit: 'lbf-ft' },
      { value: 12, unit: 'lbf-ft' },
    ]);
    const res = await EVENTS(
      apiRequest(`/api/wheels/${wheelId}/events`, {
        cookie: await cookieFor(shop.technician.userId),
      }),
      params({ wheelId }),
    );
    const { data } = (await res.json()) as { data: { state: { passes: { order: number[] }[] } } };
    expect(data.state.passes).toHaveLength(4);
    expect(data.state.passes[0]!.order).toHaveLength(24);
    // The runner page shows the snapshot's targets and limits, not the edited spec's.
    await actAs(shop.technician.userId);
    const page = (await RunPage({
      params: Promise.resolve({ jobId, wheelId }),
      searchParams: Promise.resolve({}),
    })) as { props: RunnerProps };
    expect(page.props.targets).toEqual([
      { value: 3.6, unit: 'lbf-ft' },
      { value: 8.4, unit: 'lbf-ft' },
      { value: 12, unit: 'lbf-ft' },
      { value: 12, unit: 'lbf-ft' },
    ]);
    expect(page.props.plan.boltCount).toBe(24);
    // A wheel not yet started follows the edited spec.
    const fresh = (await getJob(shop.shopId, jobId)).wheels[1]!.id;
    await post(shop.technician.userId, [ev('step_done', { step: 'safety', checklist: [] })], fresh);
    const [other] = await getDb()
      .select({ snapshot: jobWheels.snapshot })
      .from(jobWheels)
      .where(eq(jobWheels.id, fresh));
    expect(other!.snapshot).toMatchObject({ spec: { boltCount: 16, finalTorque: { value: 20 } } });
  });
});

describe('what was used', () => {
  it('a bolt confirmation keeps the wrench and setting the phone showed, and the pass target from the snapshot', async () => {
    await verifiedAt(shop.technician, records.wrench.id, new Date(Date.now() - 31 * 60_000));
    await post(shop.technician.userId, [
      ev('bolt_confirmed', {
        pass: 1,
        bolt: 1,
        wrenchId: records.wrench.id,
        setting: { value: 43, unit: 'lbf-in' },
        target: { value: 999, unit: 'Nm' },
      }),
    ]);
    const [row] = await rows();
    expect(row!.payload).toEqual({
      pass: 1,
      bolt: 1,
      wrenchId: records.wrench.id,
      setting: { value: 43, unit: 'lbf-in' },
      target: { value: 3.6, unit: 'lbf-ft' },
    });
  });

  it("wrench_chosen is refused for another shop's wrench, one without a verification the policy accepts, one overdue for calibration or out of service; a verified wrench is stored", async () => {
    const other = await createTestShop('Other');
    const theirs = await createRecords(other.lead, other.technician.userId);
    const choose = (wrenchId: string) => ev('wrench_chosen', { pass: 1, wrenchId });
    const unverified = await post(shop.technician.userId, [
      choose(theirs.wrench.id),
      choose(records.wrench.id),
    ]);
    expect(unverified).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({
            index: 0,
            message: "That wrench is not in this shop's tool crib.",
          }),
          expect.objectContaining({
            index: 1,
            message: expect.stringMatching(/No passing verification today/),
          }),
        ],
      },
    });
    // Verified at 40 in-lb, near pass 1's 43.2 in-lb setting (within the default ±25 %).
    await recordVerification(
      shop.technician,
      records.wrench.id,
      verificationSchema.parse({ referenceValue: 40, readingValue: 40.5, unit: 'lbf-in' }),
    );
    expect(
      await post(shop.technician.userId, [
        ev('wrench_chosen', { pass: 1, wrenchId: records.wrench.id }, new Date().toISOString()),
      ]),
    ).toMatchObject({ ok: true, data: { saved: 1, refused: [] } });
    await getDb()
      .update(wrenches)
      .set({ calibrationDueOn: '2020-01-01' })
      .where(eq(wrenches.id, records.wrench.id));
    expect(
      await post(shop.technician.userId, [
        ev('wrench_chosen', { pass: 1, wrenchId: records.wrench.id }, new Date().toISOString()),
      ]),
    ).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({
            message: expect.stringMatching(/overdue for calibration \(due 2020-01-01\)/),
          }),
        ],
      },
    });
    await getDb()
      .update(wrenches)
      .set({ status: 'out_of_service', statusReason: 'Dropped' })
      .where(eq(wrenches.id, records.wrench.id));
    expect(
      await post(shop.technician.userId, [
        ev('wrench_chosen', { pass: 1, wrenchId: records.wrench.id }, new Date().toISOString()),
      ]),
    ).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({ message: expect.stringMatching(/out of service \(Dropped\)/) }),
        ],
      },
    });
  });
});

describe('all or nothing, nothing dropped silently', () => {
  it('a batch with one bad event stores the rest; the refusal is recorded with wheel, person, reason and the raw event', async () => {
    const bad = ev('bolt_confirmed', { pass: 9, bolt: 1 });
    const good = [
      ev('bolt_confirmed', { pass: 1, bolt: 1 }),
      ev('bolt_confirmed', { pass: 1, bolt: 13 }),
    ];
    const result = await post(shop.technician.userId, [good[0], bad, good[1]]);
    expect(result).toMatchObject({
      ok: true,
      data: {
        saved: 2,
        refused: [
          expect.objectContaining({ index: 1, message: "Pass 9 is not in this wheel's plan." }),
        ],
      },
    });
    expect((await rows()).map((r) => r.clientId).sort()).toEqual(
      good.map((e) => e.clientId).sort(),
    );
    const [recorded] = await refusedRows();
    expect(recorded).toMatchObject({
      shopId: shop.shopId,
      jobId,
      wheelId,
      clientId: bad.clientId,
      byId: shop.technician.userId,
      reason: "Pass 9 is not in this wheel's plan.",
      raw: bad,
    });
    // Sent again (the phone retried), it is recorded once.
    await post(shop.technician.userId, [bad]);
    expect(await refusedRows()).toHaveLength(1);
  });

  it('the first event starts an open job in the same transaction, by the person who sent it', async () => {
    await post(shop.technician.userId, [ev('step_done', { step: 'safety', checklist: [] })]);
    const job = await getJob(shop.shopId, jobId);
    expect(job.state).toBe('in_progress');
    const [start] = await getDb()
      .select({ byId: jobEvents.byId })
      .from(jobEvents)
      .where(and(eq(jobEvents.jobId, jobId), eq(jobEvents.action, 'start')));
    expect(start!.byId).toBe(shop.technician.userId);
  });

  it("a phone clock far off is pulled into the server's window; the phone's own time is kept", async () => {
    const future = ev('bolt_confirmed', { pass: 1, bolt: 1 }, '2199-01-01T00:00:00.000Z');
    const past = ev('bolt_confirmed', { pass: 1, bolt: 13 }, '2001-01-01T00:00:00.000Z');
    const before = Date.now();
    await post(shop.technician.userId, [future, past]);
    const stored = await rows();
    const f = stored.find((r) => r.clientId === future.clientId)!;
    const p = stored.find((r) => r.clientId === past.clientId)!;
    expect(f.clientAt.getTime()).toBeLessThanOrEqual(Date.now() + 5 * 60_000);
    expect(f.deviceAt?.toISOString()).toBe('2199-01-01T00:00:00.000Z');
    expect(p.clientAt.getTime()).toBeGreaterThanOrEqual(before - 24 * 3600_000 - 1000);
    expect(p.deviceAt?.toISOString()).toBe('2001-01-01T00:00:00.000Z');
  });

  it('events sent to a submitted wheel are refused and recorded for the review', async () => {
    await post(shop.technician.userId, [ev('step_done', { step: 'safety', checklist: [] })]);
    await getDb()
      .update(jobWheels)
      .set({ submittedAt: new Date(), submittedById: shop.technician.userId })
      .where(eq(jobWheels.id, wheelId));
    const late = ev('bolt_confirmed', { pass: 1, bolt: 1 });
    expect(await post(shop.technician.userId, [late])).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({ message: 'This wheel was submitted; its record is closed.' }),
        ],
      },
    });
    expect(await refusedRows()).toEqual([
      expect.objectContaining({
        clientId: late.clientId,
        reason: 'This wheel was submitted; its record is closed.',
      }),
    ]);
  });
});

describe('who did it', () => {
  it("events are stored under the session's person, never a person the phone names", async () => {
    // A shared phone: the lead signed in after the technician. Whatever the events carry, they are the lead's.
    const e = { ...ev('bolt_confirmed', { pass: 1, bolt: 1 }), byId: shop.technician.userId };
    await post(shop.lead.userId, [e]);
    const [row] = await rows();
    expect(row!.byId).toBe(shop.lead.userId);
  });
});

describe('the wrench a bolt names is judged even when the phone never sent a choice (its default wrench)', () => {
  it('a bolt confirmed with an out-of-service or unverified wrench is refused and recorded; with a verified one it is stored', async () => {
    const bolt = (n: number) =>
      ev(
        'bolt_confirmed',
        { pass: 1, bolt: n, wrenchId: records.wrench.id, setting: { value: 43, unit: 'lbf-in' } },
        new Date().toISOString(),
      );
    expect(await post(shop.technician.userId, [bolt(1)])).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({
            message: expect.stringMatching(/No passing verification today/),
          }),
        ],
      },
    });
    await verifiedAt(shop.technician, records.wrench.id, new Date(Date.now() - 60_000));
    expect(await post(shop.technician.userId, [bolt(1)])).toMatchObject({
      ok: true,
      data: { saved: 1, refused: [] },
    });
    await getDb()
      .update(wrenches)
      .set({ status: 'out_of_service', statusReason: 'Dropped' })
      .where(eq(wrenches.id, records.wrench.id));
    // The wheel has started, so this would take the one-statement path if the path did not check.
    expect(await post(shop.technician.userId, [bolt(2)])).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({ message: expect.stringMatching(/out of service \(Dropped\)/) }),
        ],
      },
    });
    expect(
      (await rows()).filter((r) => r.type === 'bolt_confirmed').map((r) => r.payload.bolt),
    ).toEqual([1]);
    expect((await refusedRows()).length).toBe(2);
  });
});
