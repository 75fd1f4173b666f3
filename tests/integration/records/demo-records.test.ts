import { existsSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { reviewSources } from '@/app/_review/sources';
import { getJobReview } from '@/features/review/server/review-data';
import { afterAll, describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { jobs, jobWheels, users, wheelPhotos, wheelRunEvents } from '@/db/schema';
import { DEMO_PEOPLE, seedDemoShop } from '@/db/seed';
import { getJob } from '@/features/jobs/server/jobs';
import { getWorkFacts } from '@/features/jobs/server/work-facts';
import { transitionRefusal } from '@/features/jobs/transitions';
import type { ClientEvent } from '@/features/runner/events';
import { planFromSnapshot } from '@/features/runner/snapshot';
import { reduceRun, submitBlockers } from '@/features/runner/state';
import { getShopSettings } from '@/server/shop/settings';

const photoDir = path.join(os.tmpdir(), `ringpass-demo-photos-${process.pid}`);
afterAll(() => rmSync(photoDir, { recursive: true, force: true }));

/** The median seconds between consecutive confirmations of each pass of a wheel. */
function medianSecondsPerBolt(
  events: { type: string; payload: Record<string, unknown>; clientAt: Date }[],
): number[] {
  const byPass = new Map<number, number[]>();
  for (const e of events
    .filter((x) => x.type === 'bolt_confirmed')
    .sort((a, b) => a.clientAt.getTime() - b.clientAt.getTime())) {
    const pass = e.payload.pass as number;
    byPass.set(pass, [...(byPass.get(pass) ?? []), e.clientAt.getTime()]);
  }
  return [...byPass.values()].map((times) => {
    const gaps = times
      .slice(1)
      .map((t, i) => (t - times[i]!) / 1000)
      .sort((a, b) => a - b);
    return gaps[Math.floor(gaps.length / 2)] ?? Infinity;
  });
}

describe('demo data obeys the record rules on a fresh seed', () => {
  it('awaiting, signed-off and sent-back jobs carry complete records by the technician; jobs in progress partial ones; one awaiting job has a pass confirmed too fast', async () => {
    expect(await seedDemoShop(process.env.DATABASE_URL!, { photoDir })).toEqual({ created: true });
    const db = getDb();
    const people = await db
      .select({ id: users.id, email: users.email, shopId: users.shopId, role: users.role })
      .from(users);
    const lead = people.find((p) => p.email === DEMO_PEOPLE[0].email)!;
    const tech = people.find((p) => p.email === DEMO_PEOPLE[1].email)!;
    const shopId = lead.shopId;
    const settings = await getShopSettings(shopId);
    const all = await db
      .select({ id: jobs.id, state: jobs.state, assigneeId: jobs.assigneeId })
      .from(jobs)
      .where(eq(jobs.shopId, shopId));
    let tooFast = 0;
    let checkedComplete = 0;
    for (const { id, state, assigneeId } of all) {
      const card = await getJob(shopId, id);
      const wheels = await db.select().from(jobWheels).where(eq(jobWheels.jobId, id));
      const events = await db.select().from(wheelRunEvents).where(eq(wheelRunEvents.jobId, id));
      if (state === 'open') {
        expect(events, `job ${card.number}`).toEqual([]);
        continue;
      }
      expect(card.events.map((e) => e.action).slice(0, 2), `job ${card.number}`).toEqual([
        'create',
        'start',
      ]);
      const worker = assigneeId ?? lead.id;
      expect(new Set(events.map((e) => e.byId)), `job ${card.number}`).toEqual(new Set([worker]));
      if (state === 'in_progress') {
        expect(events.length).toBeGreaterThan(0);
        expect(wheels.some((w) => !w.submittedAt)).toBe(true);
        continue;
      }
      expect(worker).toBe(tech.id);
      for (const wheel of wheels) {
        const current = events.filter((e) => e.wheelId === wheel.id && !e.supersededAt);
        const photos = await db
          .select({ kind: wheelPhotos.kind, fileKey: wheelPhotos.fileKey })
          .from(wheelPhotos)
          .where(eq(wheelPhotos.wheelId, wheel.id));
        expect(wheel.snapshot, `job ${card.number} ${wheel.position}`).not.toBeNull();
        for (const p of photos) expect(existsSync(path.join(photoDir, p.fileKey))).toBe(true);
        const plan = planFromSnapshot(wheel.snapshot!, card);
        const run = reduceRun(
          plan,
          current.map(
            (e) =>
              ({
                clientId: e.clientId,
                clientAt: e.clientAt.toISOString(),
                type: e.type,
                payload: e.payload,
              }) as ClientEvent,
          ),
        );
        const blockers = submitBlockers(
          plan,
          run,
          photos.map((p) => p.kind),
        );
        if (state === 'sent_back' && wheel.rework) {
          expect(wheel.submittedAt).toBeNull();
          expect(blockers).toEqual([
            `Step not finished: ${plan.steps.find((s) => s.id === 'seat_bead')!.title}.`,
          ]);
        } else {
          expect(blockers, `job ${card.number} ${wheel.position}`).toEqual([]);
          expect(wheel.submittedById).toBe(tech.id);
          checkedComplete += 1;
        }
        if (
          state === 'awaiting_signoff' &&
          medianSecondsPerBolt(current).some((s) => s < settings.tooFastSecondsPerBolt)
        )
          tooFast += 1;
      }
      if (state === 'awaiting_signoff') {
        // The demo lead did none of the work, so may review it.
        expect(
          transitionRefusal(
            { userId: lead.id, role: 'lead' },
            card,
            'sign_off',
            await getWorkFacts(shopId, id),
          ),
        ).toBeNull();
      }
      if (state === 'sent_back')
        expect(wheels.filter((w) => w.rework && !w.submittedAt)).toHaveLength(1);
    }
    expect(checkedComplete).toBeGreaterThanOrEqual(20);
    expect(tooFast).toBe(1);
    // What the lead's review computes: one job worth a look (that pass), the other clean.
    const awaiting = all.filter((j) => j.state === 'awaiting_signoff');
    const reviews = await Promise.all(
      awaiting.map((j) => getJobReview(shopId, j.id, reviewSources)),
    );
    expect(reviews.map((r) => r.anomalies.map((a) => `${a.code}: ${a.message}`)).sort()).toEqual([
      [],
      [expect.stringMatching(/^too_fast: RF wheel: pass 2 of 4 .* median of 0\.6 s per bolt/)],
    ]);
  });
});
