import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { reviewSources } from '@/app/_review/sources';
import { getJob } from '@/features/jobs/server/jobs';
import { getJobReview } from '@/features/review/server/review-data';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords } from '@/tests/helpers/records';

describe("the review's per-bolt phone", () => {
  it('shows, per bolt, the phone that confirmed it by its short name, and says so when an older event has none', async () => {
    const shop = await createTestShop('Device Shop');
    const { job } = await createRecords(shop.lead, shop.technician.userId);
    const wheelId = (await getJob(shop.shopId, job.id)).wheels[0]!.id;
    const phone = '3f9a0c1e-2b4d-4e6f-8a9b-0c1d2e3f4a5b';
    const base = Date.now() - 60 * 60 * 1000;
    const confirm = (bolt: number, i: number, deviceId?: string) => ({
      type: 'bolt_confirmed',
      payload: { pass: 1, bolt },
      clientId: randomUUID(),
      clientAt: new Date(base + 1000 * i).toISOString(),
      ...(deviceId ? { deviceId } : {}),
    });
    await actAs(shop.technician.userId);
    const result = await postToWheelEvents(null, {
      wheelId,
      events: [confirm(1, 0, phone), confirm(13, 1)],
    } as Parameters<typeof postToWheelEvents>[1]);
    expect(result).toMatchObject({ ok: true, data: { saved: 2 } });

    const review = await getJobReview(shop.shopId, job.id, reviewSources);
    const bolts = review.wheels.find((w) => w.id === wheelId)!.record.passes[0]!.confirmed;
    expect(
      bolts.map((b) => ({ bolt: b.bolt, byId: b.byId, deviceId: b.deviceId, device: b.device })),
    ).toEqual([
      { bolt: 1, byId: shop.technician.userId, deviceId: phone, device: 'Phone 3F9A' },
      { bolt: 13, byId: shop.technician.userId, deviceId: null, device: null },
    ]);
  });
});
