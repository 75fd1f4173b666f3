import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { beforeEach, describe, expect, it } from 'vitest';
import { postToWheelEvents } from '@/tests/helpers/wheel-events-route';
import { getDb } from '@/db';
import { shopSettings, wheelRunEvents } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, verifiedAt } from '@/tests/helpers/records';

// A wrench chosen for a pass just before the shop's midnight, its bolts confirmed just after: with
// the default "verified the same day" policy, the verification no longer counts for those bolts.

type Shop = Awaited<ReturnType<typeof createTestShop>>;
let shop: Shop, wheelId: string, wrenchId: string, midnight: number;

/** A fixed-offset zone whose local midnight fell between one and two hours ago. */
function zoneWithRecentMidnight(now: Date) {
  const offset = ((now.getUTCHours() - 1 + 36) % 24) - 12; // local time = UTC − offset, 01:xx now
  const zone = offset === 0 ? 'Etc/GMT' : `Etc/GMT${offset > 0 ? '+' : '-'}${Math.abs(offset)}`;
  const localNow = now.getTime() - offset * 3_600_000;
  const localMidnight = localNow - (localNow % 86_400_000);
  return { zone, midnight: localMidnight + offset * 3_600_000 };
}

beforeEach(async () => {
  shop = await createTestShop();
  const records = await createRecords(shop.lead, shop.technician.userId);
  wrenchId = records.wrench.id;
  wheelId = (await getJob(shop.shopId, records.job.id)).wheels[0]!.id;
  const recent = zoneWithRecentMidnight(new Date());
  midnight = recent.midnight;
  await getDb()
    .update(shopSettings)
    .set({ timeZone: recent.zone })
    .where(eq(shopSettings.shopId, shop.shopId));
  await verifiedAt(shop.technician, wrenchId, new Date(midnight - 30 * 60_000));
});

const event = (type: string, payload: Record<string, unknown>, at: number) => ({
  type,
  payload,
  clientId: randomUUID(),
  clientAt: new Date(at).toISOString(),
});
const post = async (events: unknown[]) => {
  await actAs(shop.technician.userId);
  return postToWheelEvents(null, { wheelId, events } as Parameters<typeof postToWheelEvents>[1]);
};
const storedBolts = async () =>
  (await getDb().select().from(wheelRunEvents).where(eq(wheelRunEvents.wheelId, wheelId))).filter(
    (r) => r.type === 'bolt_confirmed',
  ).length;

describe("a pass that runs past the shop's midnight", () => {
  it('a bolt after midnight is judged on its own day, not taken on the choice made before it', async () => {
    const chosen = event('wrench_chosen', { pass: 1, wrenchId }, midnight - 10 * 60_000);
    const before = event('bolt_confirmed', { pass: 1, bolt: 1, wrenchId }, midnight - 5 * 60_000);
    expect(await post([chosen, before])).toMatchObject({ ok: true, data: { saved: 2 } });

    // Same wrench, same pass, already chosen: eligible for the one-statement path by everything else.
    const after = event('bolt_confirmed', { pass: 1, bolt: 13, wrenchId }, midnight + 5 * 60_000);
    const result = await post([after]);
    expect(result).toMatchObject({ ok: true, data: { saved: 0 } });
    expect((result as { data: { refused: unknown[] } }).data.refused).toHaveLength(1);
    expect(await storedBolts()).toBe(1);
  });
});
