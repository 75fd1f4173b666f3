import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { anomalyAcknowledgements, jobEvents, jobs, jobWheels, wheelSpecs } from '@/db/schema';
import { takeSnapshot } from '@/features/runner/snapshot';
import { convertTorque } from '@/features/torque-plan';
import { createTestShop } from './factories';
import { createRecords, verifiedAt } from './records';
import { awaitingSignoff } from './review-work';

/**
 * A four-wheel job run with one in-lb wrench and signed off by the lead at `at`: every wheel's
 * spec frozen on it, each pass chosen and every bolt confirmed at the wrench's setting (the target
 * in in-lb, rounded to its 1 in-lb graduation), bead-seating and set pressures recorded, one
 * anomaly acknowledged with its reason. Straight to the tables; the runner's path is tested elsewhere.
 * The ring is the test spec's 24 bolts unless `ring` says otherwise (the report bench: 32).
 */
export async function signedOffJob(
  at = new Date(),
  ring: { boltCount?: number; name?: string } = {},
) {
  const shop = await createTestShop('Dustline Test Tires');
  const records = await createRecords(shop.lead, shop.technician.userId, ring);
  const { job, wrench } = records;
  await verifiedAt(shop.lead, wrench.id, new Date(at.getTime() - 3 * 3_600_000));
  const [spec] = await getDb().select().from(wheelSpecs).where(eq(wheelSpecs.id, records.spec.id));
  const snapshot = takeSnapshot(spec!, { targetPressure: 14, pressureUnit: 'psi' }, at);
  await getDb()
    .update(jobWheels)
    .set({ snapshot })
    .where(and(eq(jobWheels.shopId, shop.shopId), eq(jobWheels.jobId, job.id)));

  const settings = snapshot.plan.passes.map((p) =>
    Math.round(convertTorque(p.target.value, p.target.unit, 'lbf-in')),
  );
  const events = [
    ...snapshot.plan.passes.flatMap((p, i) => [
      { type: 'wrench_chosen', payload: { pass: p.index, wrenchId: wrench.id } },
      ...p.order.map((bolt) => ({
        type: 'bolt_confirmed',
        payload: {
          pass: p.index,
          bolt,
          wrenchId: wrench.id,
          setting: { value: settings[i]!, unit: 'lbf-in' },
          target: p.target,
        },
      })),
    ]),
    { type: 'step_done', payload: { step: 'seat_bead', measurement: { value: 22, unit: 'psi' } } },
    { type: 'step_done', payload: { step: 'leak_check', measurement: { value: 14, unit: 'psi' } } },
  ];
  const perWheel = Object.fromEntries(['LF', 'RF', 'LR', 'RR'].map((p) => [p, events]));
  const wheels = await awaitingSignoff(shop.shopId, job.id, shop.technician.userId, {
    at: new Date(at.getTime() - 600_000),
    events: perWheel,
  });
  await getDb()
    .update(jobs)
    .set({ state: 'signed_off', updatedAt: at })
    .where(and(eq(jobs.shopId, shop.shopId), eq(jobs.id, job.id)));
  await getDb().insert(jobEvents).values({
    shopId: shop.shopId,
    jobId: job.id,
    action: 'sign_off',
    fromState: 'awaiting_signoff',
    toState: 'signed_off',
    byId: shop.lead.userId,
    at,
  });
  await getDb()
    .insert(anomalyAcknowledgements)
    .values({
      shopId: shop.shopId,
      jobId: job.id,
      wheelId: wheels.RR!,
      anomalyKey: `too_fast:${wheels.RR}:${randomUUID()}`,
      code: 'too_fast',
      message: 'RR wheel: pass 4 went faster than the shop allows.',
      reason: 'Check pass on a freshly torqued ring; I watched every click.',
      byId: shop.lead.userId,
      at,
    });
  return { shop, records, job, wheels, snapshot, settings };
}
