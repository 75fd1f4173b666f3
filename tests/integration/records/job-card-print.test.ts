import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { jobWheels, wheelSpecs } from '@/db/schema';
import { getPrintedWheels } from '@/features/jobs/server/job-card-print';
import { loadWheel, snapshotOf } from '@/features/runner/server/run';
import { createTestShop } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';

describe('the printed job card’s wheels', () => {
  it('lists the wheels in position order, each with its runner link on APP_URL and its own QR drawing', async () => {
    const shop = await createTestShop('Print Shop');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    const printed = await getPrintedWheels(shop.shopId, job.id);
    expect(printed.map((w) => w.position)).toEqual(['LF', 'RF', 'LR', 'RR']);
    for (const w of printed) {
      // APP_URL of the integration environment (tests/helpers/integration-setup.ts).
      expect(w.runnerUrl).toBe(`http://127.0.0.1:3000/jobs/${job.id}/wheels/${w.id}/run`);
      expect(w.qrSvg).toMatch(/^<svg[^>]*viewBox="0 0 \d+ \d+"/);
      expect(w.spec).toMatchObject({
        name: 'Test 24-bolt ring',
        boltCount: 24,
        pattern: { kind: 'cross' },
        finalTorque: { value: 12, unit: 'lbf-ft' },
      });
    }
    expect(new Set(printed.map((w) => w.qrSvg)).size).toBe(4);
  });

  it('shows another shop nothing of the job', async () => {
    const shop = await createTestShop('Print Shop');
    const other = await createTestShop('Other Print Shop');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    expect(await getPrintedWheels(other.shopId, job.id)).toEqual([]);
  });

  it('prints a started wheel’s spec as its runner follows it (the snapshot), not a later edit', async () => {
    const shop = await createTestShop('Print Shop');
    const { job, spec } = await createRecords(shop.lead, shop.technician.userId);
    const lf = (await getPrintedWheels(shop.shopId, job.id)).find((w) => w.position === 'LF')!;
    const ctx = await loadWheel(shop.shopId, lf.id);
    await getDb()
      .update(jobWheels)
      .set({ snapshot: snapshotOf(ctx), startedAt: new Date() })
      .where(eq(jobWheels.id, lf.id));
    await getDb().update(wheelSpecs).set({ finalTorque: 15 }).where(eq(wheelSpecs.id, spec.id));

    const printed = await getPrintedWheels(shop.shopId, job.id);
    const torque = (position: string) =>
      printed.find((w) => w.position === position)!.spec.finalTorque.value;
    expect(torque('LF')).toBe(12);
    expect(torque('RF')).toBe(15);
  });
});
