import { describe, expect, it } from 'vitest';
import { GET as REVIEW } from '@/app/api/jobs/[jobId]/review/route';
import { GET as QUEUE } from '@/app/api/signoff-queue/route';
import { apiRequest, cookieFor, createTestShop, params } from '@/tests/helpers/factories';
import { createRecords } from '@/tests/helpers/records';
import { awaitingSignoff } from '@/tests/helpers/review-work';

const queue = async (userId: string) =>
  QUEUE(apiRequest('/api/signoff-queue', { cookie: await cookieFor(userId) }), params({}));
const review = async (userId: string, jobId: string) =>
  REVIEW(
    apiRequest(`/api/jobs/${jobId}/review`, { cookie: await cookieFor(userId) }),
    params({ jobId }),
  );

async function shopWithQueue() {
  const shop = await createTestShop('Queue Shop');
  const newer = await createRecords(shop.lead, shop.technician.userId);
  const older = await createRecords(shop.lead, shop.technician.userId);
  const inProgress = await createRecords(shop.lead, shop.technician.userId);
  // The newer job: RR lacks its inner bead photo (blocks), LF skipped "Clean" with a reason (notes).
  await awaitingSignoff(shop.shopId, newer.job.id, shop.technician.userId, {
    at: new Date('2026-03-10T18:00:00Z'),
    missingPhotos: { RR: ['bead_inner'] },
    events: {
      LF: [
        { type: 'step_done', payload: { step: 'safety', checklist: [] } },
        {
          type: 'step_skipped',
          payload: { step: 'clean', reason: 'new ring, holes already clean' },
        },
      ],
    },
  });
  await awaitingSignoff(shop.shopId, older.job.id, shop.technician.userId, {
    at: new Date('2026-03-10T15:00:00Z'),
  });
  return { shop, newer, older, inProgress };
}

describe('GET /api/signoff-queue', () => {
  it("lists the shop's jobs awaiting sign-off, oldest first, with anomaly counts by severity", async () => {
    const { shop, newer, older } = await shopWithQueue();
    const res = await queue(shop.lead.userId);
    expect(res.status).toBe(200);
    const { data } = (await res.json()) as {
      data: {
        count: number;
        jobs: {
          id: string;
          number: number;
          awaitingSince: string;
          blocks: number;
          notes: number;
          customerName: string;
          assigneeName: string;
        }[];
      };
    };
    expect(data.count).toBe(2);
    expect(data.jobs.map((j) => [j.number, j.awaitingSince, j.blocks, j.notes])).toEqual([
      [older.job.number, '2026-03-10T15:00:00.000Z', 0, 0],
      [newer.job.number, '2026-03-10T18:00:00.000Z', 1, 1],
    ]);
    expect(data.jobs[0]).toMatchObject({
      customerName: 'Wren Halloway',
      assigneeName: 'Theo Tech',
    });
  });

  it('is for leads only, and a lead of another shop sees none of it', async () => {
    const { shop } = await shopWithQueue();
    for (const who of [shop.technician, shop.apprentice])
      expect((await queue(who.userId)).status, who.role).toBe(403);
    const other = await createTestShop('Other Shop');
    const res = await queue(other.lead.userId);
    expect(await res.json()).toEqual({ data: { count: 0, jobs: [] } });
  });
});

describe('GET /api/jobs/:jobId/review', () => {
  it('reads the record with its anomalies first, the plan each wheel is judged against, photos and skipped steps', async () => {
    const { shop, newer } = await shopWithQueue();
    const res = await review(shop.lead.userId, newer.job.id);
    expect(res.status).toBe(200);
    const { data } = (await res.json()) as {
      data: {
        anomalies: { code: string; severity: string; message: string }[];
        wheels: {
          position: string;
          source: string;
          plan: { boltCount: number; passes: unknown[] };
          photos: { kind: string; url: string }[];
          record: { steps: { id: string; status: string; reason: string | null }[] };
        }[];
      };
    };
    expect(data.anomalies.map((a) => [a.code, a.severity])).toEqual([
      ['photo_missing', 'blocks'],
      ['step_skipped', 'notes'],
    ]);
    expect(data.anomalies[0]!.message).toBe(
      'RR wheel: no seated-bead (inner face) photo; the seated bead cannot be checked from the record.',
    );
    expect(data.wheels.map((w) => w.position)).toEqual(['LF', 'RF', 'LR', 'RR']);
    // No snapshot was taken (the run was stored directly): the live 24-bolt spec, 30/70/100 % and a check pass.
    expect(data.wheels[0]).toMatchObject({ source: 'live_spec', plan: { boltCount: 24 } });
    expect(data.wheels[0]!.plan.passes).toHaveLength(4);
    expect(data.wheels[0]!.record.steps.find((s) => s.id === 'clean')).toMatchObject({
      status: 'skipped',
      reason: 'new ring, holes already clean',
    });
    expect(data.wheels[3]!.photos.map((p) => p.kind)).toEqual(['bead_outer']);
    expect(data.wheels[3]!.photos[0]!.url).toMatch(/^\/api\/photos\/[0-9a-f-]{36}$/);
  });

  it("is not found for another shop's lead and forbidden to a technician", async () => {
    const { shop, newer } = await shopWithQueue();
    const other = await createTestShop('Other Shop');
    expect((await review(other.lead.userId, newer.job.id)).status).toBe(404);
    expect((await review(shop.technician.userId, newer.job.id)).status).toBe(403);
  });
});

describe('a wheel run through the runner save path', () => {
  it('is judged against its snapshot, with the wrench and setting each bolt carried', async () => {
    const { postToWheelEvents } = await import('@/tests/helpers/wheel-events-route');
    const { recordVerification } = await import('@/features/tool-crib/server/wrenches');
    const { actAs } = await import('@/tests/helpers/next-request');
    const { randomUUID } = await import('node:crypto');
    const shop = await createTestShop('Runner Review Shop');
    const { job, wrench } = await createRecords(shop.lead, shop.technician.userId);
    await recordVerification(shop.lead, wrench.id, {
      referenceValue: 43,
      readingValue: 43,
      unit: 'lbf-in',
    });
    const wheelId = (
      await import('@/features/jobs/server/jobs').then((m) => m.getJob(shop.shopId, job.id))
    ).wheels[0]!.id;
    const start = Date.now() + 1000; // after the verification: a wrench is judged as it stood when chosen
    const at = (i: number) => new Date(start + i * 300).toISOString();
    const events = [
      {
        type: 'wrench_chosen',
        payload: { pass: 1, wrenchId: wrench.id },
        clientId: randomUUID(),
        clientAt: at(0),
      },
      ...[1, 13, 7, 19].map((bolt, i) => ({
        type: 'bolt_confirmed',
        payload: { pass: 1, bolt, wrenchId: wrench.id, setting: { value: 43, unit: 'lbf-in' } },
        clientId: randomUUID(),
        clientAt: at(i + 1),
      })),
    ];
    await actAs(shop.technician.userId);
    expect(
      await postToWheelEvents(null, { wheelId, events } as Parameters<typeof postToWheelEvents>[1]),
    ).toMatchObject({ ok: true, data: { saved: 5 } });
    const res = await review(shop.lead.userId, job.id);
    expect(res.status, await res.clone().text()).toBe(200);
    const { data } = (await res.json()) as {
      data: {
        anomalies: { code: string; pass?: number }[];
        wheels: {
          source: string;
          wrenchUses: Record<string, { label: string; setting: unknown; verification: string }[]>;
        }[];
      };
    };
    expect(data.wheels[0]!.source).toBe('snapshot');
    expect(data.wheels[0]!.wrenchUses['1']).toEqual([
      expect.objectContaining({
        label: 'Test click 20–200 in-lb',
        setting: { value: 43, unit: 'lbf-in' },
        verification: 'verified at 43 in-lb',
      }),
    ]);
    // 0.3 s a bolt: too fast at the shop's 1.5 s.
    expect(data.anomalies.filter((a) => a.code === 'too_fast').map((a) => a.pass)).toEqual([1]);
  });
});

describe('GET /api/signoff-queue?only=count', () => {
  it('answers the number alone for the nav, and refuses an unknown option', async () => {
    const { shop } = await shopWithQueue();
    const res = await QUEUE(
      apiRequest('/api/signoff-queue?only=count', { cookie: await cookieFor(shop.lead.userId) }),
      params({}),
    );
    expect(await res.json()).toEqual({ data: { count: 2, jobs: [] } });
    const bad = await QUEUE(
      apiRequest('/api/signoff-queue?only=everything', {
        cookie: await cookieFor(shop.lead.userId),
      }),
      params({}),
    );
    expect(bad.status).toBe(400);
  });
});
