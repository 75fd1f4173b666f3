import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { jobs, jobWheels } from '@/db/schema';
import { createJob } from '@/features/jobs/server/jobs';
import { listMyWheels } from '@/features/jobs/server/my-wheels';
import { createTestShop } from '@/tests/helpers/factories';
import { createRecords, fourWheels } from '@/tests/helpers/records';

const HOUR = 3_600_000;

describe('My wheels', () => {
  it("lists the technician's unfinished wheels: sent back first, then in progress, then open by due time and job number; never another person's or a submitted wheel", async () => {
    const shop = await createTestShop();
    const db = getDb();
    const {
      spec,
      customer,
      vehicle,
      job: noDue,
    } = await createRecords(shop.lead, shop.technician.userId);
    const newJob = (assigneeId: string) =>
      createJob(shop.lead, {
        customerId: customer.id,
        vehicleId: vehicle.id,
        wheels: fourWheels(spec.id).slice(0, 2),
        dismount: true,
        reinstall: true,
        assigneeId,
        notes: '',
        acceptAxleMismatch: false,
      });
    const later = await newJob(shop.technician.userId);
    const soon = await newJob(shop.technician.userId);
    const leads = await newJob(shop.lead.userId);
    await db
      .update(jobs)
      .set({ dueAt: new Date(Date.now() + 48 * HOUR) })
      .where(eq(jobs.id, later.id));
    await db
      .update(jobs)
      .set({ dueAt: new Date(Date.now() + 2 * HOUR) })
      .where(eq(jobs.id, soon.id));
    const wheel = (jobId: string, position: 'LF' | 'RF' | 'LR' | 'RR') =>
      and(eq(jobWheels.jobId, jobId), eq(jobWheels.position, position));

    // The no-due job: RF was sent back, LF is submitted, LR is under way.
    await db.update(jobs).set({ state: 'sent_back' }).where(eq(jobs.id, noDue.id));
    await db
      .update(jobWheels)
      .set({
        rework: {
          note: 'Re-seat the bead',
          steps: [],
          byId: shop.lead.userId,
          at: new Date().toISOString(),
        },
      })
      .where(wheel(noDue.id, 'RF'));
    await db
      .update(jobWheels)
      .set({ submittedAt: new Date(), submittedById: shop.technician.userId })
      .where(wheel(noDue.id, 'LF'));
    await db.update(jobWheels).set({ startedAt: new Date() }).where(wheel(noDue.id, 'LR'));
    // The later job's RF stopped on a failed inspection: a lead must look, so it goes last.
    await db
      .update(jobWheels)
      .set({ flaggedReason: 'Crack at a bolt hole' })
      .where(wheel(later.id, 'RF'));

    const list = await listMyWheels(shop.technician);
    const seen = list.map((w) => `#${w.jobNumber} ${w.position} ${w.status}`);
    expect(seen).toEqual([
      `#${noDue.number} RF sent_back`,
      `#${noDue.number} LR in_progress`,
      `#${soon.number} LF open`,
      `#${soon.number} RF open`,
      `#${later.number} LF open`,
      `#${noDue.number} RR open`,
      `#${later.number} RF stopped`,
    ]);
    expect(list[0]).toMatchObject({
      customer: 'Wren Halloway',
      vehicle: '2022 Talonworks Ridgeback',
      tireSize: '30x10R14',
      specName: 'Test 24-bolt ring',
      reworkNote: 'Re-seat the bead',
      dueAt: null,
    });
    expect(list.some((w) => w.jobId === leads.id)).toBe(false);
    expect((await listMyWheels(shop.lead)).map((w) => w.jobId)).toEqual([leads.id, leads.id]);
  });

  it("never shows a job waiting for sign-off, nor another shop's wheels", async () => {
    const shop = await createTestShop();
    const other = await createTestShop('Other');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await createRecords(other.lead, other.technician.userId);
    await getDb().update(jobs).set({ state: 'awaiting_signoff' }).where(eq(jobs.id, job.id));
    expect(await listMyWheels(shop.technician)).toEqual([]);
    expect(await listMyWheels({ ...other.technician, shopId: shop.shopId })).toEqual([]);
  });
});
