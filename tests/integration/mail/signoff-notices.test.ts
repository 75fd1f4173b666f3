import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { sendBackReviewed } from '@/app/(shop)/jobs/[jobId]/review/actions';
import { getDb } from '@/db';
import { jobs, users } from '@/db/schema';
import { transitionJob } from '@/features/jobs/server/transitions';
import { createTestShop } from '@/tests/helpers/factories';
import { waitForMail } from '@/tests/helpers/mailbox';
import { actAs } from '@/tests/helpers/next-request';
import { runQueueWorker } from '@/tests/helpers/queue';
import { createRecords } from '@/tests/helpers/records';
import { INTEGRATION_SINK } from '@/tests/helpers/test-services';
import { workAndSubmitWheels } from '@/tests/helpers/wheel-work';

// The notices go out from the queue: a worker runs for this file, as `npm run worker` would.
runQueueWorker();

async function submittedJob() {
  const shop = await createTestShop('Notice Shop');
  const secondLead = `second-lead-${randomUUID().slice(0, 8)}@shop.test`;
  await getDb().insert(users).values({
    shopId: shop.shopId,
    role: 'lead',
    name: 'Sol Second',
    email: secondLead,
    passwordHash: 'x',
  });
  const { job } = await createRecords(shop.lead, shop.technician.userId);
  await getDb()
    .update(jobs)
    .set({ state: 'in_progress' })
    .where(and(eq(jobs.shopId, shop.shopId), eq(jobs.id, job.id)));
  const wheelIds = await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
  await transitionJob(shop.technician, job.id, 'submit', '');
  return { shop, job, secondLead, wheelIds };
}

describe('sign-off notices by e-mail', () => {
  it('tells every lead of the shop that a job awaits sign-off, with a link to its review', async () => {
    const { shop, job, secondLead } = await submittedJob();
    for (const to of [shop.lead.email, secondLead]) {
      const mail = await waitForMail(INTEGRATION_SINK.dir, to);
      expect(mail.subject).toBe(`Job ${job.number} is waiting for sign-off`);
      expect(mail.shopId).toBe(shop.shopId);
      expect(mail.text).toContain(
        `Theo Tech submitted job ${job.number} (Wren Halloway, 2022 Talonworks Ridgeback) for sign-off.`,
      );
      expect(mail.text).toMatch(new RegExp(`Review it: http://[^ ]+/jobs/${job.id}/review`));
    }
  });

  it('tells the technician which wheels came back and what to redo', async () => {
    const { shop, job, wheelIds } = await submittedJob();
    await actAs(shop.lead.userId);
    expect(
      await sendBackReviewed(null, {
        jobId: job.id,
        wheels: [
          { wheelId: wheelIds[0]!, note: 'Redo pass 2 at a steady pace.', steps: ['torque'] },
        ],
      }),
    ).toMatchObject({ ok: true });
    const mail = await waitForMail(INTEGRATION_SINK.dir, shop.technician.email);
    expect(mail.subject).toMatch(new RegExp(`^Job ${job.number} was sent back: (LF|RF|LR|RR)$`));
    expect(mail.shopId).toBe(shop.shopId);
    expect(mail.text).toContain(
      `Lena Lead sent job ${job.number} (Wren Halloway, 2022 Talonworks Ridgeback) back.`,
    );
    expect(mail.text).toMatch(
      /(LF|RF|LR|RR) wheel: Redo pass 2 at a steady pace\. \(redo: torque\)/,
    );
  });
});
