import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { wrenches, wrenchStatusEvents } from '@/db/schema';
import { putBackInService, verifyWrench } from '@/features/tool-crib/actions/wrench-actions';
import { wrenchSchema } from '@/features/tool-crib/schemas';
import {
  createWrench,
  getWrench,
  listWrenches,
  updateWrench,
  wrenchesForEngine,
  wrenchHistory,
} from '@/features/tool-crib/server/wrenches';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { wrenchBody } from '@/tests/helpers/records';

describe('tool crib', () => {
  it('a passing verification keeps the wrench in service; a failing one takes it out at once', async () => {
    const shop = await createTestShop();
    const w = await createWrench(shop.lead, wrenchSchema.parse(wrenchBody));
    await actAs(shop.technician.userId);
    expect(
      await verifyWrench(null, {
        wrenchId: w.id,
        referenceValue: 100,
        readingValue: 103.9,
        unit: 'lbf-in',
      }),
    ).toMatchObject({
      ok: true,
      data: { withinTolerance: true, deviationPct: 3.9, tolerancePct: 4 },
    });
    expect((await getWrench(shop.shopId, w.id)).status).toBe('in_service');

    expect(
      await verifyWrench(null, {
        wrenchId: w.id,
        referenceValue: 100,
        readingValue: 95,
        unit: 'lbf-in',
      }),
    ).toMatchObject({ ok: true, data: { withinTolerance: false, deviationPct: -5 } });
    expect(await getWrench(shop.shopId, w.id)).toMatchObject({
      status: 'out_of_service',
      statusReason: 'Verification out of tolerance: -5.0 % (allowed ±4 %)',
    });
    expect(await wrenchesForEngine(shop.shopId)).toEqual([]);

    // A later good reading does not put it back; only a lead does, with a reason.
    await verifyWrench(null, {
      wrenchId: w.id,
      referenceValue: 100,
      readingValue: 100,
      unit: 'lbf-in',
    });
    expect((await getWrench(shop.shopId, w.id)).status).toBe('out_of_service');
    expect(
      await putBackInService(null, { wrenchId: w.id, reason: 'Recalibrated by the lab' }),
    ).toEqual({ ok: false, code: 'forbidden', message: 'Your role does not allow this.' });
    await actAs(shop.lead.userId);
    expect(
      await putBackInService(null, { wrenchId: w.id, reason: 'Recalibrated by the lab' }),
    ).toMatchObject({ ok: true, data: { status: 'in_service' } });

    const history = await wrenchHistory(shop.shopId, w.id);
    expect(
      history.map((h) =>
        h.type === 'status' ? `${h.status}:${h.by}` : `check:${h.withinTolerance}`,
      ),
    ).toEqual([
      'in_service:Lena Lead',
      'check:true',
      'out_of_service:Theo Tech',
      'check:false',
      'check:true',
    ]);
  });

  it('an apprentice cannot record a verification', async () => {
    const shop = await createTestShop();
    const w = await createWrench(shop.lead, wrenchSchema.parse(wrenchBody));
    await actAs(shop.apprentice.userId);
    expect(
      await verifyWrench(null, {
        wrenchId: w.id,
        referenceValue: 100,
        readingValue: 100,
        unit: 'lbf-in',
      }),
    ).toMatchObject({ ok: false, message: 'Your role does not allow this.' });
  });

  it('an overdue calibration, or 5,000 cycles, puts a wrench out of service, and a lead cannot clear it until recalibrated', async () => {
    const shop = await createTestShop();
    const w = await createWrench(shop.lead, wrenchSchema.parse(wrenchBody));
    const cycles = await createWrench(
      shop.lead,
      wrenchSchema.parse({ ...wrenchBody, label: 'Worn', cyclesSinceCalibration: 5000 }),
    );
    await getDb()
      .update(wrenches)
      .set({ calibrationDueOn: '2020-01-01' })
      .where(eq(wrenches.id, w.id));
    const crib = await listWrenches(shop.shopId);
    expect(crib.find((x) => x.id === w.id)).toMatchObject({
      status: 'out_of_service',
      statusReason: 'Calibration overdue (was due 2020-01-01)',
    });
    expect(crib.find((x) => x.id === cycles.id)).toMatchObject({
      status: 'out_of_service',
      statusReason: 'Cycle count reached 5000: recalibrate',
    });
    await actAs(shop.lead.userId);
    expect(
      await putBackInService(null, { wrenchId: w.id, reason: 'Looks fine to me' }),
    ).toMatchObject({ ok: false, message: expect.stringMatching(/calibration is overdue/) });
  });

  it("a lead's edit that reaches 5,000 cycles puts the wrench out of service at once, with an event, not at the next hourly sweep", async () => {
    const shop = await createTestShop();
    const stored = async (id: string) => {
      const [row] = await getDb()
        .select({ status: wrenches.status, reason: wrenches.statusReason })
        .from(wrenches)
        .where(eq(wrenches.id, id));
      const events = await getDb()
        .select({ reason: wrenchStatusEvents.reason })
        .from(wrenchStatusEvents)
        .where(eq(wrenchStatusEvents.wrenchId, id));
      return { ...row, events: events.map((e) => e.reason) };
    };
    const created = await createWrench(
      shop.lead,
      wrenchSchema.parse({ ...wrenchBody, label: 'Worn', cyclesSinceCalibration: 5000 }),
    );
    const reason = 'Cycle count reached 5000: recalibrate';
    expect(await stored(created.id)).toEqual({
      status: 'out_of_service',
      reason,
      events: [reason],
    });
    const w = await createWrench(shop.lead, wrenchSchema.parse(wrenchBody));
    expect(await stored(w.id)).toEqual({ status: 'in_service', reason: '', events: [] });
    await updateWrench(
      shop.lead,
      w.id,
      wrenchSchema.parse({ ...wrenchBody, cyclesSinceCalibration: 5000 }),
    );
    expect(await stored(w.id)).toEqual({ status: 'out_of_service', reason, events: [reason] });
  });

  it('a wrench the engine refuses cannot be saved', async () => {
    const shop = await createTestShop();
    await expect(
      createWrench(shop.lead, wrenchSchema.parse({ ...wrenchBody, graduation: 500 })),
    ).rejects.toMatchObject({
      code: 'invalid',
      fields: { graduation: [expect.stringMatching(/graduation/)] },
    });
  });
});
