import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { jobs, shopSettings, wrenches } from '@/db/schema';
import { boardQuerySchema } from '@/features/jobs/schemas';
import { listBoard } from '@/features/jobs/server/board';
import { createJob } from '@/features/jobs/server/jobs';
import { sweepOverdue } from '@/features/tool-crib/server/wrenches';
import { createTestShop } from '@/tests/helpers/factories';
import { createRecords, fourWheels } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;

const setZone = (shopId: string, timeZone: string) =>
  getDb().update(shopSettings).set({ timeZone }).where(eq(shopSettings.shopId, shopId));

/** 23:30 on 1 December at a Denver shop (MST, UTC−7), while UTC is already on 2 December. */
const LATE_EVENING = new Date('2026-12-02T06:30:00Z');

/** Job cards due at the given instants, numbered from 1002 in order (1001 has no due time). */
async function jobsDueAt(shop: Shop, dues: string[]) {
  const { customer, vehicle, spec } = await createRecords(shop.lead, shop.technician.userId);
  for (const due of dues) {
    const job = await createJob(shop.lead, {
      customerId: customer.id,
      vehicleId: vehicle.id,
      wheels: fourWheels(spec.id),
      dismount: true,
      reinstall: true,
      assigneeId: shop.technician.userId,
      notes: '',
      acceptAxleMismatch: false,
    });
    await getDb()
      .update(jobs)
      .set({ dueAt: new Date(due) })
      .where(and(eq(jobs.shopId, shop.shopId), eq(jobs.id, job.id)));
  }
}

const numbers = async (shop: Shop, due: string, now = LATE_EVENING) =>
  (await listBoard(shop.lead, boardQuerySchema.parse({ due, sort: 'number' }), now)).data.map(
    (r) => r.number,
  );

describe("the board's due filter on the shop's calendar", () => {
  it('around the shop’s midnight, "today" is the shop’s day, not the UTC date', async () => {
    const shop = await createTestShop();
    await setZone(shop.shopId, 'America/Denver');
    await jobsDueAt(shop, [
      '2026-12-02T06:45:00Z', // 1002: 23:45 on 1 Dec at the shop — later today
      '2026-12-02T07:15:00Z', // 1003: 00:15 on 2 Dec at the shop — tomorrow, though the same UTC date as now
      '2026-12-01T18:00:00Z', // 1004: 11:00 on 1 Dec at the shop — earlier today, so overdue too
      '2026-12-09T06:00:00Z', // 1005: 23:00 on 8 Dec — the last of the 7 shop days after today
      '2026-12-09T08:00:00Z', // 1006: 01:00 on 9 Dec — past them
    ]);
    expect(await numbers(shop, 'today')).toEqual([1002, 1004]);
    expect(await numbers(shop, 'overdue')).toEqual([1004]);
    expect(await numbers(shop, 'week')).toEqual([1002, 1003, 1005]);
    // An hour later (00:30) it is 2 December at the shop: only 1003 is today, and like 1002 it is past.
    const pastMidnight = new Date('2026-12-02T07:30:00Z');
    expect(await numbers(shop, 'today', pastMidnight)).toEqual([1003]);
    expect(await numbers(shop, 'overdue', pastMidnight)).toEqual([1002, 1003, 1004]);
  });

  it('the same job cards in a shop on UTC split the days at UTC midnight instead', async () => {
    const shop = await createTestShop();
    await jobsDueAt(shop, ['2026-12-02T06:45:00Z', '2026-12-02T07:15:00Z', '2026-12-01T18:00:00Z']);
    expect(await numbers(shop, 'today')).toEqual([1002, 1003]);
  });
});

describe("the calibration sweep on the shop's calendar", () => {
  const status = async (id: string) =>
    (
      await getDb()
        .select({ status: wrenches.status, reason: wrenches.statusReason })
        .from(wrenches)
        .where(eq(wrenches.id, id))
    )[0];

  it('a wrench due on 1 December is still in service at 23:30 that evening in Denver, and out of service after the shop’s midnight', async () => {
    const shop = await createTestShop();
    await setZone(shop.shopId, 'America/Denver');
    const { wrench } = await createRecords(shop.lead, shop.technician.userId);
    await getDb()
      .update(wrenches)
      .set({ calibrationDueOn: '2026-12-01' })
      .where(eq(wrenches.id, wrench.id));

    await sweepOverdue(shop.shopId, LATE_EVENING);
    expect(await status(wrench.id)).toEqual({ status: 'in_service', reason: '' });

    await sweepOverdue(shop.shopId, new Date('2026-12-02T07:00:00Z'));
    expect(await status(wrench.id)).toEqual({
      status: 'out_of_service',
      reason: 'Calibration overdue (was due 2026-12-01)',
    });
  });

  it('in a shop on UTC the same moment is already 2 December, so the wrench is overdue', async () => {
    const shop = await createTestShop();
    const { wrench } = await createRecords(shop.lead, shop.technician.userId);
    await getDb()
      .update(wrenches)
      .set({ calibrationDueOn: '2026-12-01' })
      .where(eq(wrenches.id, wrench.id));
    await sweepOverdue(shop.shopId, LATE_EVENING);
    expect((await status(wrench.id))?.status).toBe('out_of_service');
  });
});
