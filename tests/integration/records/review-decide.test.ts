import { and, eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { approveReviewed, sendBackReviewed } from '@/app/(shop)/jobs/[jobId]/review/actions';
import { getDb } from '@/db';
import { anomalyAcknowledgements, jobEvents, jobs, jobWheels } from '@/db/schema';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

async function awaitingWithMissingPhoto() {
  const shop = await createTestShop('Decide Shop');
  const { job } = await createRecords(shop.lead, shop.technician.userId);
  const wheels = await awaitingSignoff(shop.shopId, job.id, shop.technician.userId, {
    at: new Date(),
    missingPhotos: { RR: ['bead_inner'] },
  });
  return { shop, jobId: job.id, wheels };
}
const stateOf = async (jobId: string) =>
  (await getDb().select({ state: jobs.state }).from(jobs).where(eq(jobs.id, jobId)))[0]!.state;

describe('deciding on a reviewed job card', () => {
  it('refuses a sign-off while a blocking anomaly has no reason, and changes nothing', async () => {
    const { shop, jobId, wheels } = await awaitingWithMissingPhoto();
    await actAs(shop.lead.userId);
    const result = await approveReviewed(null, {
      jobId,
      acknowledgements: [{ key: 'some-other-key', reason: 'not this one' }],
    });
    expect(result).toMatchObject({
      ok: false,
      code: 'invalid',
      message: 'Acknowledge every anomaly that blocks sign-off with a reason first.',
    });
    expect(!result.ok && result.fieldErrors).toEqual({
      [`acknowledgements.photo_missing:${wheels.RR}:-:bead_inner`]: [
        'Say why this is acceptable before signing off.',
      ],
    });
    expect(await stateOf(jobId)).toBe('awaiting_signoff');
    expect(
      await getDb()
        .select()
        .from(anomalyAcknowledgements)
        .where(eq(anomalyAcknowledgements.jobId, jobId)),
    ).toEqual([]);
  });

  it('signs off with the reason stored beside who and when, and the history says why', async () => {
    const { shop, jobId, wheels } = await awaitingWithMissingPhoto();
    await actAs(shop.lead.userId);
    const key = `photo_missing:${wheels.RR}:-:bead_inner`;
    const result = await approveReviewed(null, {
      jobId,
      acknowledgements: [{ key, reason: 'Checked the inner bead myself at the counter.' }],
    });
    expect(result).toMatchObject({ ok: true, data: { acknowledged: 1 } });
    expect(await stateOf(jobId)).toBe('signed_off');
    const [ack] = await getDb()
      .select()
      .from(anomalyAcknowledgements)
      .where(eq(anomalyAcknowledgements.jobId, jobId));
    expect(ack).toMatchObject({
      anomalyKey: key,
      code: 'photo_missing',
      wheelId: wheels.RR,
      reason: 'Checked the inner bead myself at the counter.',
      byId: shop.lead.userId,
    });
    const [event] = await getDb()
      .select()
      .from(jobEvents)
      .where(and(eq(jobEvents.jobId, jobId), eq(jobEvents.action, 'sign_off')));
    expect(event!.note).toBe(
      'Acknowledged: RR wheel: no seated-bead (inner face) photo; the seated bead cannot be checked from the record. Reason: Checked the inner bead myself at the counter.',
    );
    expect(event!.byId).toBe(shop.lead.userId);
  });

  it('does not let the technician who did the work decide', async () => {
    const { shop, jobId } = await awaitingWithMissingPhoto();
    await actAs(shop.technician.userId);
    expect(await approveReviewed(null, { jobId })).toMatchObject({ ok: false, code: 'forbidden' });
    expect(await stateOf(jobId)).toBe('awaiting_signoff');
  });

  it('sends back only the wheel named, with its note for the technician', async () => {
    const { shop, jobId, wheels } = await awaitingWithMissingPhoto();
    await actAs(shop.lead.userId);
    const result = await sendBackReviewed(null, {
      jobId,
      wheels: [
        {
          wheelId: wheels.RR!,
          note: 'Photograph the inner bead, then resubmit.',
          steps: ['seat_bead'],
        },
      ],
    });
    expect(result).toMatchObject({ ok: true });
    expect(await stateOf(jobId)).toBe('sent_back');
    const rows = await getDb()
      .select({ id: jobWheels.id, submittedAt: jobWheels.submittedAt, rework: jobWheels.rework })
      .from(jobWheels)
      .where(eq(jobWheels.jobId, jobId));
    const rr = rows.find((r) => r.id === wheels.RR)!;
    expect(rr.submittedAt).toBeNull();
    expect(rr.rework).toMatchObject({
      note: 'Photograph the inner bead, then resubmit.',
      steps: ['seat_bead'],
    });
    expect(rows.filter((r) => r.id !== wheels.RR).every((r) => r.submittedAt)).toBe(true);
    const [event] = await getDb()
      .select()
      .from(jobEvents)
      .where(and(eq(jobEvents.jobId, jobId), eq(jobEvents.action, 'send_back')));
    expect(event!.note).toBe('RR: Photograph the inner bead, then resubmit.');
  });
});
