import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import * as specItem from '@/app/api/specs/[specId]/route';
import * as specList from '@/app/api/specs/route';
import { getDb } from '@/db';
import { jobWheels, wheelRunEvents, wheelSpecs } from '@/db/schema';
import { DEMO_PEOPLE, seedDemoShop } from '@/db/seed';
import { getJob } from '@/features/jobs/server/jobs';
import { transitionJob } from '@/features/jobs/server/transitions';
import { createWheelSpec, updateWheelSpec } from '@/features/specs/actions/save-spec';
import { specSchema } from '@/features/specs/schemas';
import { createSpec, getSpec, listSpecs, updateSpec } from '@/features/specs/server/specs';
import { checkPlausibility } from '@/features/torque-plan';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, specBody } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, records: Awaited<ReturnType<typeof createRecords>>;

beforeEach(async () => {
  shop = await createTestShop();
  records = await createRecords(shop.lead, shop.technician.userId);
});

// 35 bar is 507.6 psi (1 bar = 100 kPa, 1 psi = 6.894 757 kPa: NIST SP 811 App. B), far above the
// tire industry's 40 psi bead-seating guidance for passenger and light-truck tires.
const thirtyFiveBar = {
  ...specBody,
  name: 'Kestrel 16 in sport',
  maxBeadSeatPressure: 35,
  runningPressure: 1.2,
  pressureUnit: 'bar' as const,
};
const rating = 'Tire maker data book TB-7, p. 12 (fictional)';

describe('a spec with a dangerous bead-seating limit changes nothing', () => {
  it('through the API: 400 naming the field and psi; no spec created, the stored one unchanged', async () => {
    const cookie = await cookieFor(shop.lead.userId);
    const created = await specList.POST(
      apiRequest('/api/specs', { method: 'POST', cookie, body: thirtyFiveBar }),
      params({}),
    );
    expect(created.status).toBe(400);
    const body = (await created.json()) as {
      error: { message: string; fields: Record<string, string[]> };
    };
    expect(body.error.fields.maxBeadSeatPressure![0]).toMatch(
      /^35 bar is 507\.6 psi: above the 40 psi bead-seating ceiling/,
    );
    expect(await listSpecs(shop.shopId)).toHaveLength(1);

    const before = await getSpec(shop.shopId, records.spec.id);
    const patched = await specItem.PATCH(
      apiRequest(`/api/specs/${records.spec.id}`, { method: 'PATCH', cookie, body: thirtyFiveBar }),
      params({ specId: records.spec.id }),
    );
    expect(patched.status).toBe(400);
    expect(await getSpec(shop.shopId, records.spec.id)).toEqual(before);
  });

  it('through the save action: refused at the field with psi named; nothing created or changed', async () => {
    await actAs(shop.lead.userId);
    const created = await createWheelSpec(null, thirtyFiveBar);
    expect(created).toMatchObject({
      ok: false,
      code: 'invalid',
      message: expect.stringMatching(/nothing was saved: 35 bar is 507\.6 psi/),
      fieldErrors: { maxBeadSeatPressure: [expect.stringMatching(/507\.6 psi/)] },
    });
    expect(await listSpecs(shop.shopId)).toHaveLength(1);
    const before = await getSpec(shop.shopId, records.spec.id);
    expect(
      await updateWheelSpec(null, { ...thirtyFiveBar, specId: records.spec.id }),
    ).toMatchObject({
      ok: false,
      fieldErrors: { maxBeadSeatPressure: [expect.stringMatching(/psi/)] },
    });
    expect(await getSpec(shop.shopId, records.spec.id)).toEqual(before);
  });

  it('warnings do not block: a 3.5× limit-to-running spec saves', async () => {
    await actAs(shop.lead.userId);
    // A saved spec goes to its page (a redirect).
    await expect(
      createWheelSpec(null, {
        ...specBody,
        name: 'Low running',
        maxBeadSeatPressure: 35,
        runningPressure: 10,
      }),
    ).rejects.toMatchObject({ digest: expect.stringContaining('/specs/') });
    expect(await listSpecs(shop.shopId)).toHaveLength(2);
  });
});

describe("the tire maker's higher bead-seat rating", () => {
  const fifty = {
    ...specBody,
    name: 'Rated 50 psi',
    maxBeadSeatPressure: 50,
    runningPressure: 35,
    beadSeatRatingReference: rating,
  };

  it('a lead confirming it with a reference is accepted, and who and when are stored', async () => {
    await actAs(shop.lead.userId);
    expect(await createWheelSpec(null, fifty)).toMatchObject({
      ok: false,
      fieldErrors: { beadSeatRatingConfirmed: [expect.stringMatching(/lead confirms/)] },
    });
    const spec = await createSpec(
      shop.lead,
      specSchema.parse({ ...fifty, beadSeatRatingConfirmed: true }),
    );
    expect(spec).toMatchObject({
      maxBeadSeatPressure: 50,
      beadSeatRatingReference: rating,
      beadSeatRatingConfirmedById: shop.lead.userId,
      beadSeatRatingConfirmedAt: expect.any(String),
    });
  });

  it('a technician cannot confirm it: the API answers 403 and the data layer refuses too', async () => {
    const cookie = await cookieFor(shop.technician.userId);
    const res = await specList.POST(
      apiRequest('/api/specs', {
        method: 'POST',
        cookie,
        body: { ...fifty, beadSeatRatingConfirmed: true },
      }),
      params({}),
    );
    expect(res.status).toBe(403);
    await expect(
      createSpec(shop.technician, specSchema.parse({ ...fifty, beadSeatRatingConfirmed: true })),
    ).rejects.toMatchObject({ code: 'forbidden', message: expect.stringMatching(/Only a lead/) });
    expect(await listSpecs(shop.shopId)).toHaveLength(1);
  });
});

describe('flagged specs (stored before the rules)', () => {
  const flag = (reason: string | null) =>
    getDb()
      .update(wheelSpecs)
      .set({ plausibilityFlag: reason })
      .where(and(eq(wheelSpecs.shopId, shop.shopId), eq(wheelSpecs.id, records.spec.id)));
  const reason = 'Bead-seating limit 35 bar is 507.6 psi: above the 40 psi bead-seating ceiling.';
  let t = 0;
  const confirm = (bolt: number) => ({
    type: 'bolt_confirmed',
    payload: { pass: 1, bolt },
    clientId: randomUUID(),
    clientAt: new Date(Date.UTC(2026, 0, 1, 9, 0, t++)).toISOString(),
  });
  const save = async (wheelId: string, events: unknown[]) => {
    await actAs(shop.technician.userId);
    return postToWheelEvents(null, { wheelId, events } as Parameters<typeof postToWheelEvents>[1]);
  };

  it("block the runner's save (without starting the job), show on the job card, and clear when a lead saves a plausible spec", async () => {
    const wheel = (await getJob(shop.shopId, records.job.id)).wheels[0]!;
    await flag(reason);
    expect((await getJob(shop.shopId, records.job.id)).wheels[0]!.specFlag).toBe(reason);
    const refused = await save(wheel.id, [confirm(1)]);
    expect(refused).toMatchObject({
      ok: false,
      code: 'conflict',
      message: expect.stringMatching(/flagged and cannot be run until a lead corrects it/),
    });
    expect((await getJob(shop.shopId, records.job.id)).state).toBe('open');

    // The fast path (job already in progress) refuses too.
    await transitionJob(shop.lead, records.job.id, 'start', '');
    expect(await save(wheel.id, [confirm(1)])).toMatchObject({ ok: false, code: 'conflict' });
    expect(
      await getDb()
        .select({ clientId: wheelRunEvents.clientId })
        .from(wheelRunEvents)
        .where(eq(wheelRunEvents.wheelId, wheel.id)),
    ).toEqual([]);

    await updateSpec(shop.lead, records.spec.id, specSchema.parse(specBody));
    expect((await getSpec(shop.shopId, records.spec.id)).plausibilityFlag).toBeNull();
    expect(await save(wheel.id, [confirm(1)])).toMatchObject({ ok: true, data: { saved: 1 } });
  });
});

describe('the demo seed', () => {
  it('passes its self-check into a fresh database: plausible specs, each wheel at its spec running pressure', async () => {
    expect(await seedDemoShop(process.env.DATABASE_URL!)).toEqual({ created: true });
    const specs = await getDb()
      .select()
      .from(wheelSpecs)
      .innerJoin(jobWheels, eq(jobWheels.specId, wheelSpecs.id));
    expect(specs.length).toBeGreaterThan(0);
    for (const { wheel_specs: s, job_wheels: w } of specs) {
      expect(s.plausibilityFlag).toBeNull();
      const lugTorque =
        s.lugTorque && s.lugTorqueUnit ? { value: s.lugTorque, unit: s.lugTorqueUnit } : null;
      const { errors, warnings } = checkPlausibility({
        ...s,
        fractions: s.passFractions,
        lugTorque,
      });
      expect(warnings).toEqual([]);
      expect(errors).toEqual([]);
      expect([w.targetPressure, w.pressureUnit]).toEqual([s.runningPressure, s.pressureUnit]);
    }
    const kestrel = specs.find((r) => r.wheel_specs.name.startsWith('Kestrel'))!.wheel_specs;
    expect([kestrel.maxBeadSeatPressure, kestrel.pressureUnit]).toEqual([2.4, 'bar']);
    expect(DEMO_PEOPLE[0].role).toBe('lead');
  });
});
