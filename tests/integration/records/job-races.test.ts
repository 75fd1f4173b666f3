import { eq } from 'drizzle-orm';
import postgres from 'postgres';
import { afterAll, describe, expect, it } from 'vitest';
import { getDb } from '@/db';
import { jobs, jobWheels } from '@/db/schema';
import { addWheel, updateJob } from '@/features/jobs/server/jobs';
import { transitionJob } from '@/features/jobs/server/transitions';
import { createTestShop } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';

// Another device's change, made and held uncommitted on its own connection while this one checks
// and writes; then committed. The write must be judged on the state at the moment of writing.
const otherDevice = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
afterAll(() => otherDevice.end());

async function whileAnotherDeviceChanges<T>(
  change: (sql: postgres.TransactionSql) => Promise<unknown>,
  act: () => Promise<T>,
) {
  const held = await otherDevice.reserve();
  try {
    await held`begin`;
    await change(held as unknown as postgres.TransactionSql);
    const outcome = act().then(
      (value) => ({ ok: true as const, value }),
      (error: unknown) => ({ ok: false as const, error }),
    );
    // Give the write time to reach the held row (it waits on the lock when the code locks it).
    const deadline = Date.now() + 3000;
    while (Date.now() < deadline) {
      const [row] = await getDb().execute<{ n: number }>(
        `select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock'`,
      );
      if (row?.n) break;
      await new Promise((r) => setTimeout(r, 50));
    }
    await held`commit`;
    return await outcome;
  } finally {
    held.release();
  }
}

describe('job cards changed by two devices at once', () => {
  it('an edit that races a sign-off does not change the signed-off record', async () => {
    const shop = await createTestShop();
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await getDb().update(jobs).set({ state: 'awaiting_signoff' }).where(eq(jobs.id, job.id));
    const result = await whileAnotherDeviceChanges(
      (sql) => sql`update jobs set state = 'signed_off' where id = ${job.id}`,
      () => updateJob(shop.lead, job.id, { notes: 'late edit' }),
    );
    expect(result).toMatchObject({ ok: false, error: { code: 'conflict' } });
    const [row] = await getDb()
      .select({ notes: jobs.notes, state: jobs.state })
      .from(jobs)
      .where(eq(jobs.id, job.id));
    expect(row).toEqual({ notes: '', state: 'signed_off' });
  });

  it('a wheel added while the job is being started is refused, not slipped into the running job', async () => {
    const shop = await createTestShop();
    const { job, spec } = await createRecords(shop.lead, shop.technician.userId);
    const result = await whileAnotherDeviceChanges(
      (sql) => sql`update jobs set state = 'in_progress' where id = ${job.id}`,
      () =>
        addWheel(shop.lead, job.id, {
          position: 'spare',
          specId: spec.id,
          tireSize: '30x10R14',
          directional: false,
          targetPressure: 14,
          pressureUnit: 'psi',
        }),
    );
    expect(result).toMatchObject({ ok: false, error: { code: 'conflict' } });
    expect(await getDb().$count(jobWheels, eq(jobWheels.jobId, job.id))).toBe(4);
  });

  it('a start by the technician is refused when a lead reassigned the job meanwhile', async () => {
    const shop = await createTestShop();
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    const result = await whileAnotherDeviceChanges(
      (sql) => sql`update jobs set assignee_id = ${shop.lead.userId} where id = ${job.id}`,
      () => transitionJob(shop.technician, job.id, 'start', ''),
    );
    expect(result).toMatchObject({ ok: false, error: { code: 'conflict' } });
    const [row] = await getDb().select({ state: jobs.state }).from(jobs).where(eq(jobs.id, job.id));
    expect(row).toEqual({ state: 'open' });
  });
});
