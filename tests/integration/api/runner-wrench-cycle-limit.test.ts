import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { getDb } from '@/db';
import { wheelRunEvents, wrenches } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, verifiedAt } from '@/tests/helpers/records';

// Recalibration at 5,000 cycles: ISO 6789 (secondary sources), as PRODUCT.md states it.
const LIMIT = 5000;

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, wheelId: string, wrenchId: string;

beforeEach(async () => {
  shop = await createTestShop();
  const records = await createRecords(shop.lead, shop.technician.userId);
  wrenchId = records.wrench.id;
  wheelId = (await getJob(shop.shopId, records.job.id)).wheels[0]!.id;
  await verifiedAt(shop.technician, wrenchId, new Date(base - 1000));
});

let t = 0;
const base = Date.now() - 60 * 60 * 1000;
const at = () => new Date(base + 1000 * t++).toISOString();
const event = (type: string, payload: Record<string, unknown>) => ({
  type,
  payload,
  clientId: randomUUID(),
  clientAt: at(),
});
const chosen = () => event('wrench_chosen', { pass: 1, wrenchId });
const confirm = (bolt: number) => event('bolt_confirmed', { pass: 1, bolt, wrenchId });
const post = async (events: unknown[]) => {
  await actAs(shop.technician.userId);
  return postToWheelEvents(null, { wheelId, events } as Parameters<typeof postToWheelEvents>[1]);
};
const setCycles = (n: number) =>
  getDb().update(wrenches).set({ cyclesSinceCalibration: n }).where(eq(wrenches.id, wrenchId));
const storedBolts = async () =>
  (await getDb().select().from(wheelRunEvents).where(eq(wheelRunEvents.wheelId, wheelId)))
    .filter((r) => r.type === 'bolt_confirmed')
    .map((r) => (r.payload as { bolt: number }).bolt)
    .sort((a, b) => a - b);
const refusedAtLimit = {
  ok: true,
  data: {
    saved: 0,
    refused: [
      expect.objectContaining({
        message: `Test click 20–200 in-lb has reached ${LIMIT} cycles since calibration (limit ${LIMIT}); it cannot be used for a pass.`,
        fieldErrors: { 'payload.wrenchId': [expect.stringMatching(/reached 5000 cycles/)] },
      }),
    ],
  },
};

describe('a wrench at its cycle limit, before the hourly sweep puts it out of service', () => {
  it('a bolt confirmation naming it is refused on the full path (the first event of the wheel)', async () => {
    await setCycles(LIMIT);
    expect(await post([confirm(1)])).toMatchObject(refusedAtLimit);
    expect(await storedBolts()).toEqual([]);
  });

  it('a bolt confirmation naming it is refused after the limit is reached mid-pass (the one-statement path would otherwise take it)', async () => {
    await setCycles(LIMIT - 1);
    // Chosen and used for pass 1 while one cycle remained: the last cycle it has.
    expect(await post([chosen(), confirm(1)])).toMatchObject({
      ok: true,
      data: { saved: 2, refused: [] },
    });
    // Same wrench, same pass, already chosen: the batch is eligible for the one-statement path.
    expect(await post([confirm(13)])).toMatchObject(refusedAtLimit);
    expect(await storedBolts()).toEqual([1]);
    const [w] = await getDb()
      .select({ n: wrenches.cyclesSinceCalibration })
      .from(wrenches)
      .where(eq(wrenches.id, wrenchId));
    expect(w!.n).toBe(LIMIT);
  });

  it('below the limit the same bolt is taken', async () => {
    await setCycles(LIMIT - 2);
    await post([chosen(), confirm(1)]);
    expect(await post([confirm(13)])).toMatchObject({ ok: true, data: { saved: 1, refused: [] } });
    expect(await storedBolts()).toEqual([1, 13]);
  });
});
