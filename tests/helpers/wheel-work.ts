import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobWheels, wheelRunEvents } from '@/db/schema';

/**
 * Stands in for a person running and submitting every wheel of a job (the runner's own path is
 * tested elsewhere): one event per wheel by `byId`, then each wheel submitted by them.
 */
export async function workAndSubmitWheels(shopId: string, jobId: string, byId: string) {
  const wheels = await getDb()
    .select({ id: jobWheels.id })
    .from(jobWheels)
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  for (const w of wheels) {
    await getDb()
      .insert(wheelRunEvents)
      .values({
        shopId,
        jobId,
        wheelId: w.id,
        clientId: randomUUID(),
        type: 'step_done',
        payload: { step: 'safety', checklist: [] },
        byId,
        clientAt: new Date(),
      });
  }
  await getDb()
    .update(jobWheels)
    .set({ submittedAt: new Date(), submittedById: byId })
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  return wheels.map((w) => w.id);
}
