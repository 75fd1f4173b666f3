import { eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { wrenches, wrenchStatusEvents } from '@/db/schema';
import { getWrench, listWrenches, wrenchesForEngine } from '@/features/tool-crib/server/wrenches';
import { sendJob } from '@/server/queue/boss';
import { startWorker } from '@/server/queue/worker';
import { queueHandlers } from '@/app/_worker/handlers';
import { createTestShop } from '@/tests/helpers/factories';
import { drainQueues } from '@/tests/helpers/queue';
import { createRecords } from '@/tests/helpers/records';

const stored = async (id: string) =>
  (
    await getDb()
      .select({ status: wrenches.status, reason: wrenches.statusReason })
      .from(wrenches)
      .where(eq(wrenches.id, id))
  )[0];
const events = async (id: string) =>
  getDb()
    .select({ status: wrenchStatusEvents.status })
    .from(wrenchStatusEvents)
    .where(eq(wrenchStatusEvents.wrenchId, id));

async function overdueWrench() {
  const shop = await createTestShop();
  const { wrench } = await createRecords(shop.lead, shop.technician.userId);
  await getDb()
    .update(wrenches)
    .set({ calibrationDueOn: '2026-01-05' })
    .where(eq(wrenches.id, wrench.id));
  return { shop, wrenchId: wrench.id };
}

describe('the tool crib’s overdue sweep, on the queue', () => {
  it('between sweeps a read shows an overdue wrench out of service and never offers it, without writing', async () => {
    const { shop, wrenchId } = await overdueWrench();
    expect(await getWrench(shop.shopId, wrenchId)).toMatchObject({
      status: 'out_of_service',
      statusReason: 'Calibration overdue (was due 2026-01-05)',
    });
    expect((await listWrenches(shop.shopId)).map((w) => w.status)).toEqual(['out_of_service']);
    expect(await wrenchesForEngine(shop.shopId)).toEqual([]);
    expect(await stored(wrenchId)).toEqual({ status: 'in_service', reason: '' });
    expect(await events(wrenchId)).toEqual([]);
  });

  it('the sweep job takes overdue wrenches out of service in every shop, with one event each', async () => {
    const a = await overdueWrench();
    const b = await overdueWrench();
    await sendJob('wrench-overdue-sweep', {});
    await drainQueues({}, { names: ['wrench-overdue-sweep'] });
    for (const { wrenchId } of [a, b]) {
      expect(await stored(wrenchId)).toEqual({
        status: 'out_of_service',
        reason: 'Calibration overdue (was due 2026-01-05)',
      });
      expect(await events(wrenchId)).toEqual([{ status: 'out_of_service' }]);
    }
    // A second sweep finds nothing left to do.
    await sendJob('wrench-overdue-sweep', {});
    await drainQueues({}, { names: ['wrench-overdue-sweep'] });
    expect(await events(a.wrenchId)).toHaveLength(1);
  });

  it('a worker keeps it scheduled hourly', async () => {
    const worker = await startWorker(queueHandlers(), { pollingIntervalSeconds: 0.5 });
    await worker.stop();
    const rows = await getDb().execute<{ name: string; cron: string }>(
      sql`select name, cron from pgboss.schedule`,
    );
    expect([...rows]).toEqual([{ name: 'wrench-overdue-sweep', cron: '5 * * * *' }]);
  });
});
