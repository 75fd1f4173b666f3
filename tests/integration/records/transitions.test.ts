import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { reviewSources } from '@/app/_review/sources';
import * as jobTransitions from '@/app/api/jobs/[jobId]/transitions/route';
import { getDb } from '@/db';
import { jobWheels, shopSettings, users, wheelPhotos, wheelRunEvents } from '@/db/schema';
import { getJob, updateJob } from '@/features/jobs/server/jobs';
import { transitionJob } from '@/features/jobs/server/transitions';
import { getJobReview } from '@/features/review/server/review-data';
import type { Member } from '@/server/auth/session';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { workAndSubmitWheels } from '@/tests/helpers/wheel-work';

type Shop = Awaited<ReturnType<typeof createTestShop>>;

async function secondLead(shop: Shop): Promise<Member> {
  const [row] = await getDb()
    .insert(users)
    .values({
      shopId: shop.shopId,
      role: 'lead',
      name: 'Lou Second',
      email: `lead2-${randomUUID().slice(0, 8)}@shop.test`,
      passwordHash: 'x',
    })
    .returning({ id: users.id, email: users.email });
  return {
    userId: row!.id,
    shopId: shop.shopId,
    role: 'lead',
    email: row!.email,
    name: 'Lou Second',
    sessionId: 'test',
  };
}

// These tests are about who may sign off; a sign-off also answers for each anomaly that blocks.
async function withAcknowledgements(shopId: string, jobId: string, body: { action: string }) {
  if (body.action !== 'sign_off') return body;
  const review = await getJobReview(shopId, jobId, reviewSources);
  return {
    ...body,
    acknowledgements: review.anomalies
      .filter((a) => a.severity === 'blocks')
      .map((a) => ({ key: a.key, reason: 'Looked at it with the technician.' })),
  };
}

const move = async (
  userId: string,
  jobId: string,
  body: { action: string; note?: string; wheels?: unknown },
) => {
  const [user] = await getDb()
    .select({ shopId: users.shopId })
    .from(users)
    .where(eq(users.id, userId));
  const sent = await withAcknowledgements(user!.shopId, jobId, body);
  return jobTransitions.POST(
    apiRequest(`/api/jobs/${jobId}/transitions`, {
      method: 'POST',
      cookie: await cookieFor(userId),
      body: sent,
    }),
    params({ jobId }),
  );
};

describe('submit needs the wheel work', () => {
  it('a job card with no wheels cannot be submitted, so never signed off', async () => {
    const shop = await createTestShop();
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await getDb().delete(jobWheels).where(eq(jobWheels.jobId, job.id));
    expect((await move(shop.technician.userId, job.id, { action: 'start' })).status).toBe(200);
    const submit = await move(shop.technician.userId, job.id, { action: 'submit' });
    expect(submit.status).toBe(409);
    expect(await submit.json()).toMatchObject({
      error: { message: expect.stringMatching(/no wheels/) },
    });
    expect((await move(shop.lead.userId, job.id, { action: 'sign_off' })).status).toBe(409);
    expect((await getJob(shop.shopId, job.id)).state).toBe('in_progress');
  });

  it('wheels not yet submitted, or a flagged wheel, hold the job back', async () => {
    const shop = await createTestShop();
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    await expect(transitionJob(shop.technician, job.id, 'submit', '')).rejects.toMatchObject({
      code: 'conflict',
      message: expect.stringMatching(/still open: LF, RF, LR, RR/),
    });
    const [first] = await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
    await getDb()
      .update(jobWheels)
      .set({ flaggedReason: 'Cracked ring' })
      .where(eq(jobWheels.id, first!));
    await expect(transitionJob(shop.technician, job.id, 'submit', '')).rejects.toMatchObject({
      code: 'conflict',
      message: expect.stringMatching(/flagged \(LF\)/),
    });
    await getDb().update(jobWheels).set({ flaggedReason: null }).where(eq(jobWheels.id, first!));
    expect((await transitionJob(shop.technician, job.id, 'submit', '')).state).toBe(
      'awaiting_signoff',
    );
  });
});

describe('sign-off by a lead who did none of the work', () => {
  it('the unassign-yourself trick fails: the lead who recorded the events cannot sign off; another lead can', async () => {
    const shop = await createTestShop();
    const other = await secondLead(shop);
    const { job } = await createRecords(shop.lead, shop.lead.userId);
    await transitionJob(shop.lead, job.id, 'start', '');
    await workAndSubmitWheels(shop.shopId, job.id, shop.lead.userId);
    await updateJob(shop.lead, job.id, { assigneeId: shop.technician.userId });
    await transitionJob(shop.lead, job.id, 'submit', '');
    const own = await move(shop.lead.userId, job.id, { action: 'sign_off' });
    expect(own.status).toBe(403);
    expect(await own.json()).toMatchObject({
      error: { message: expect.stringMatching(/You worked on this job card/) },
    });
    expect((await move(other.userId, job.id, { action: 'sign_off' })).status).toBe(200);
    expect((await getJob(shop.shopId, job.id)).state).toBe('signed_off');
  });

  it('a lead who only submitted the job (no events) still may not sign it off', async () => {
    const shop = await createTestShop();
    const other = await secondLead(shop);
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
    await transitionJob(other, job.id, 'submit', '');
    expect((await move(other.userId, job.id, { action: 'sign_off' })).status).toBe(403);
    expect((await move(shop.lead.userId, job.id, { action: 'sign_off' })).status).toBe(200);
  });

  it('the single-lead setting lets the only lead sign off their own work with a written reason, kept on the record', async () => {
    const shop = await createTestShop();
    const { job } = await createRecords(shop.lead, shop.lead.userId);
    await transitionJob(shop.lead, job.id, 'start', '');
    await workAndSubmitWheels(shop.shopId, job.id, shop.lead.userId);
    await transitionJob(shop.lead, job.id, 'submit', '');
    expect((await move(shop.lead.userId, job.id, { action: 'sign_off' })).status).toBe(403); // setting off
    await getDb()
      .update(shopSettings)
      .set({ singleLeadSelfSignoff: true })
      .where(eq(shopSettings.shopId, shop.shopId));
    const noReason = await move(shop.lead.userId, job.id, { action: 'sign_off' });
    expect(noReason.status).toBe(400);
    expect(await noReason.json()).toMatchObject({
      error: { fields: { note: [expect.stringMatching(/write why/)] } },
    });
    const ok = await move(shop.lead.userId, job.id, {
      action: 'sign_off',
      note: 'Only lead on shift; re-checked every ring myself.',
    });
    expect(ok.status).toBe(200);
    expect((await getJob(shop.shopId, job.id)).events.at(-1)).toMatchObject({
      action: 'sign_off',
      selfSignoff: true,
      note: expect.stringMatching(/^Only lead on shift; re-checked every ring myself\./),
    });
  });

  it('the single-lead setting does nothing once the shop has a second lead', async () => {
    const shop = await createTestShop();
    await getDb()
      .update(shopSettings)
      .set({ singleLeadSelfSignoff: true })
      .where(eq(shopSettings.shopId, shop.shopId));
    const { job } = await createRecords(shop.lead, shop.lead.userId);
    await transitionJob(shop.lead, job.id, 'start', '');
    await workAndSubmitWheels(shop.shopId, job.id, shop.lead.userId);
    await transitionJob(shop.lead, job.id, 'submit', '');
    await secondLead(shop);
    expect(
      (await move(shop.lead.userId, job.id, { action: 'sign_off', note: 'I checked it.' })).status,
    ).toBe(403);
  });

  it('the assignee is locked while the job awaits sign-off; other edits are not', async () => {
    const shop = await createTestShop();
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'submit', '');
    await expect(
      updateJob(shop.lead, job.id, { assigneeId: shop.lead.userId }),
    ).rejects.toMatchObject({
      code: 'conflict',
      fields: { assigneeId: [expect.stringMatching(/awaits sign-off/)] },
    });
    await expect(updateJob(shop.lead, job.id, { assigneeId: null })).rejects.toMatchObject({
      code: 'conflict',
    });
    expect(
      (await updateJob(shop.lead, job.id, { notes: 'Customer collects Friday.' })).assignee?.id,
    ).toBe(shop.technician.userId);
  });
});

describe('send back per wheel', () => {
  it('reopens only the named wheels, supersedes their events (all, or only those of the named steps) and keeps the notes', async () => {
    const shop = await createTestShop();
    const other = await secondLead(shop);
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    const [lf, rf, lr] = await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
    await getDb()
      .insert(wheelRunEvents)
      .values({
        shopId: shop.shopId,
        jobId: job.id,
        wheelId: rf!,
        clientId: randomUUID(),
        type: 'bolt_confirmed',
        payload: { pass: 1, bolt: 1 },
        byId: shop.technician.userId,
        clientAt: new Date(),
      });
    await transitionJob(shop.technician, job.id, 'submit', '');
    const body = {
      action: 'send_back',
      note: 'Two wheels need another look.',
      wheels: [
        { wheelId: lf, note: 'Bead photo is blurred; redo the whole wheel.' },
        { wheelId: rf, note: 'Pass 1 was far too fast; torque it again.', steps: ['torque'] },
      ],
    };
    expect(
      (
        await move(other.userId, job.id, {
          ...body,
          wheels: [{ wheelId: randomUUID(), note: 'x' }],
        })
      ).status,
    ).toBe(400);
    const res = await move(other.userId, job.id, body);
    expect(res.status).toBe(200);
    const card = await getJob(shop.shopId, job.id);
    expect(card.state).toBe('sent_back');
    expect(card.wheels.map((w) => [w.position, Boolean(w.submittedAt)])).toEqual([
      ['LF', false],
      ['RF', false],
      ['LR', true],
      ['RR', true],
    ]);
    expect(card.events.at(-1)).toMatchObject({
      action: 'send_back',
      wheels: [
        expect.objectContaining({ wheelId: lf, steps: [] }),
        expect.objectContaining({ wheelId: rf, steps: ['torque'] }),
      ],
    });
    const [rfRow] = await getDb()
      .select({ rework: jobWheels.rework })
      .from(jobWheels)
      .where(eq(jobWheels.id, rf!));
    expect(rfRow!.rework).toMatchObject({
      note: 'Pass 1 was far too fast; torque it again.',
      steps: ['torque'],
      byId: other.userId,
    });
    const current = async (wheelId: string) =>
      (
        await getDb()
          .select({ type: wheelRunEvents.type })
          .from(wheelRunEvents)
          .where(and(eq(wheelRunEvents.wheelId, wheelId), isNull(wheelRunEvents.supersededAt)))
      ).map((e) => e.type);
    expect(await current(lf!)).toEqual([]); // the whole wheel: every event superseded, none deleted
    expect(await current(rf!)).toEqual(['step_done']); // only the torque step's events
    expect(await current(lr!)).toEqual(['step_done']);
    expect(
      await getDb()
        .select({ clientId: wheelRunEvents.clientId })
        .from(wheelRunEvents)
        .where(eq(wheelRunEvents.wheelId, lf!)),
    ).toHaveLength(1);
    // The job goes round again: restarted, reworked, resubmitted.
    await transitionJob(shop.technician, job.id, 'start', '');
    await expect(transitionJob(shop.technician, job.id, 'submit', '')).rejects.toMatchObject({
      message: expect.stringMatching(/still open: LF, RF/),
    });
    // The runner takes rework for exactly the steps named: RF's torque, not its other steps; LR stays closed.
    await actAs(shop.technician.userId);
    const at = new Date().toISOString();
    const rework = await postToWheelEvents(null, {
      wheelId: rf!,
      events: [
        {
          type: 'bolt_confirmed',
          payload: { pass: 1, bolt: 1 },
          clientId: randomUUID(),
          clientAt: at,
        },
        {
          type: 'step_done',
          payload: { step: 'clean', checklist: [] },
          clientId: randomUUID(),
          clientAt: at,
        },
      ],
    });
    expect(rework).toMatchObject({
      ok: true,
      data: {
        saved: 1,
        refused: [
          expect.objectContaining({
            index: 1,
            message: 'This wheel was sent back to redo torque only; the rest of its record stands.',
          }),
        ],
      },
    });
    const closed = await postToWheelEvents(null, {
      wheelId: lr!,
      events: [
        {
          type: 'bolt_confirmed',
          payload: { pass: 1, bolt: 1 },
          clientId: randomUUID(),
          clientAt: at,
        },
      ],
    });
    expect(closed).toMatchObject({
      ok: true,
      data: {
        saved: 0,
        refused: [
          expect.objectContaining({ message: 'This wheel was submitted; its record is closed.' }),
        ],
      },
    });
  });
});

describe('a sign-off answers for the anomalies on every path', () => {
  it('the transitions API refuses a sign-off that leaves a blocking anomaly without a reason, and changes nothing', async () => {
    const shop = await createTestShop();
    const other = await secondLead(shop);
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    const [first] = await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'submit', '');
    // A bead photo gone from the record: the review blocks on it.
    await getDb().delete(wheelPhotos).where(eq(wheelPhotos.wheelId, first!));
    const review = await getJobReview(shop.shopId, job.id, reviewSources);
    expect(review.anomalies.some((a) => a.severity === 'blocks')).toBe(true);
    const bare = await jobTransitions.POST(
      apiRequest(`/api/jobs/${job.id}/transitions`, {
        method: 'POST',
        cookie: await cookieFor(other.userId),
        body: { action: 'sign_off' },
      }),
      params({ jobId: job.id }),
    );
    expect(bare.status).toBe(400);
    expect((await getJob(shop.shopId, job.id)).state).toBe('awaiting_signoff');
    expect((await move(other.userId, job.id, { action: 'sign_off' })).status).toBe(200);
  });

  it('the job card path (a plain transition) never signs off: only the review does', async () => {
    const shop = await createTestShop();
    const other = await secondLead(shop);
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'start', '');
    await workAndSubmitWheels(shop.shopId, job.id, shop.technician.userId);
    await transitionJob(shop.technician, job.id, 'submit', '');
    await expect(transitionJob(other, job.id, 'sign_off', 'Looks fine')).rejects.toMatchObject({
      code: 'conflict',
      message: expect.stringMatching(/review/),
    });
    expect((await getJob(shop.shopId, job.id)).state).toBe('awaiting_signoff');
  });
});
