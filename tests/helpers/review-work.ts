import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobEvents, jobs, jobWheels, wheelPhotos, wheelRunEvents } from '@/db/schema';

type Draft = { type: string; payload: Record<string, unknown>; at?: Date };

/**
 * Puts a job card straight into awaiting sign-off, as if its technician had run and submitted it
 * `at`: the given events per wheel position, the bead photos (minus any left out), every wheel
 * submitted. The runner's own save path is tested elsewhere; the review reads what is stored.
 */
export async function awaitingSignoff(
  shopId: string,
  jobId: string,
  byId: string,
  opts: {
    at: Date;
    events?: Partial<Record<string, Draft[]>>;
    missingPhotos?: Partial<Record<string, string[]>>;
  },
) {
  const db = getDb();
  const wheels = await db
    .select({ id: jobWheels.id, position: jobWheels.position })
    .from(jobWheels)
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  for (const w of wheels) {
    const drafts = opts.events?.[w.position] ?? [
      { type: 'step_done', payload: { step: 'safety', checklist: [] } },
    ];
    await db.insert(wheelRunEvents).values(
      drafts.map((d, i) => ({
        shopId,
        jobId,
        wheelId: w.id,
        clientId: randomUUID(),
        type: d.type,
        payload: d.payload,
        byId,
        clientAt: d.at ?? new Date(opts.at.getTime() - (drafts.length - i) * 60_000),
        receivedAt: opts.at,
      })),
    );
    const kinds = (['bead_outer', 'bead_inner'] as const).filter(
      (k) => !opts.missingPhotos?.[w.position]?.includes(k),
    );
    if (kinds.length) {
      await db.insert(wheelPhotos).values(
        kinds.map((kind) => ({
          shopId,
          jobId,
          wheelId: w.id,
          kind,
          fileKey: randomUUID(),
          url: 'https://files.test/x',
          bytes: 1000,
          mime: 'image/jpeg',
          uploadedById: byId,
        })),
      );
    }
  }
  await db
    .update(jobWheels)
    .set({ submittedAt: opts.at, submittedById: byId })
    .where(and(eq(jobWheels.shopId, shopId), eq(jobWheels.jobId, jobId)));
  await db
    .update(jobs)
    .set({ state: 'awaiting_signoff', updatedAt: opts.at })
    .where(and(eq(jobs.shopId, shopId), eq(jobs.id, jobId)));
  await db.insert(jobEvents).values([
    {
      shopId,
      jobId,
      action: 'start',
      fromState: 'open',
      toState: 'in_progress',
      byId,
      at: new Date(opts.at.getTime() - 3_600_000),
    },
    {
      shopId,
      jobId,
      action: 'submit',
      fromState: 'in_progress',
      toState: 'awaiting_signoff',
      byId,
      at: opts.at,
    },
  ]);
  return Object.fromEntries(wheels.map((w) => [w.position, w.id]));
}
