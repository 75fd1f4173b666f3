import { describe, expect, it } from 'vitest';
import RunPage from '@/app/(runner)/jobs/[jobId]/wheels/[wheelId]/run/page';
import { getDb } from '@/db';
import { wrenchVerifications } from '@/db/schema';
import { getJob } from '@/features/jobs/server/jobs';
import type { RunnerProps } from '@/features/runner/components/runner';
import { passWrench } from '@/features/runner/wrench-gate';
import { updateShopSettings } from '@/features/settings/server/settings';
import { verificationSchema, wrenchSchema } from '@/features/tool-crib/schemas';
import { addDays, shopDay, startOfShopDay } from '@/features/ui/shop-time';
import { createWrench, recordVerification } from '@/features/tool-crib/server/wrenches';
import { createTestShop } from '@/tests/helpers/factories';
import { actAs } from '@/tests/helpers/next-request';
import { createRecords, wrenchBody } from '@/tests/helpers/records';

type Shop = Awaited<ReturnType<typeof createTestShop>>;

/** A technician's wheel: the spec is 12 ft-lb in passes of 30/70/100 % plus a check pass (43, 101, 144, 144 in-lb). */
async function wheelFor(shop: Shop) {
  const records = await createRecords(shop.lead, shop.technician.userId);
  const job = await getJob(shop.shopId, records.job.id);
  return { ...records, jobId: job.id, wheelId: job.wheels[0]!.id };
}

/** The runner page as the technician's phone gets it: its props, as the page computed them. */
async function runnerProps(shop: Shop, jobId: string, wheelId: string): Promise<RunnerProps> {
  await actAs(shop.technician.userId);
  const element = (await RunPage({
    params: Promise.resolve({ jobId, wheelId }),
    searchParams: Promise.resolve({}),
  })) as { props: RunnerProps };
  return element.props;
}

/** What the torque step would show for each pass, right now. */
function offered(props: RunnerProps, now = new Date()) {
  return props.targets.map((target) => {
    const gate = passWrench({
      target,
      wrenches: props.wrenches,
      rules: props.rules,
      verifications: props.verifications,
      now,
    });
    if (!gate.choice?.ok) return 'no wrench';
    return `${gate.wrench!.label} at ${gate.choice.setting.value} ${gate.choice.setting.unit}${gate.verification?.counts ? '' : ' (verify first)'}`;
  });
}

const verify = (
  shop: Shop,
  wrenchId: string,
  referenceValue: number,
  unit: 'lbf-in' | 'lbf-ft' = 'lbf-in',
) =>
  recordVerification(
    shop.technician,
    wrenchId,
    verificationSchema.parse({ referenceValue, readingValue: referenceValue, unit }),
  );

describe("the runner page's wrench gate reads the shop's settings", () => {
  it('a changed wrench floor changes the wrench the runner offers', async () => {
    const shop = await createTestShop();
    const { jobId, wheelId, wrench } = await wheelFor(shop);
    const grey = await createWrench(
      shop.lead,
      wrenchSchema.parse({
        ...wrenchBody,
        label: 'Grey 5–80 ft-lb',
        min: 5,
        max: 80,
        unit: 'lbf-ft',
      }),
    );
    await updateShopSettings(shop.lead, { verification: { nearPercent: 0 } }); // any point counts here: this test is about the floor
    await verify(shop, wrench.id, 100);
    await verify(shop, grey.id, 40, 'lbf-ft');

    // 20 %: the grey wrench's floor is 16 ft-lb, so every pass goes to the in-lb wrench.
    expect(offered(await runnerProps(shop, jobId, wheelId))).toEqual([
      'Test click 20–200 in-lb at 43 lbf-in',
      'Test click 20–200 in-lb at 101 lbf-in',
      'Test click 20–200 in-lb at 144 lbf-in',
      'Test click 20–200 in-lb at 144 lbf-in',
    ]);

    // 75 %: even 144 in-lb is only 72 % of the in-lb wrench's 200, and 12 ft-lb 15 % of the grey one's 80: nothing suits.
    await updateShopSettings(shop.lead, { wrenchFloorPercent: 75 });
    expect(offered(await runnerProps(shop, jobId, wheelId))).toEqual([
      'no wrench',
      'no wrench',
      'no wrench',
      'no wrench',
    ]);

    // 0 %: with the in-lb wrench out of the crib, the grey one runs 8.4 and 12 ft-lb (only its 5 ft-lb mark limits it).
    await updateShopSettings(shop.lead, { wrenchFloorPercent: 0 });
    const props = await runnerProps(shop, jobId, wheelId);
    expect(props.rules.minFractionOfMax).toBe(0);
    expect(offered({ ...props, wrenches: props.wrenches.filter((w) => w.id === grey.id) })).toEqual(
      [
        'no wrench',
        'Grey 5–80 ft-lb at 8 lbf-ft',
        'Grey 5–80 ft-lb at 12 lbf-ft',
        'Grey 5–80 ft-lb at 12 lbf-ft',
      ],
    );
  });

  it('a verification counts only near the pass setting (±25 % by default); 0 % accepts any point', async () => {
    const shop = await createTestShop();
    const { jobId, wheelId, wrench } = await wheelFor(shop);
    await verify(shop, wrench.id, 100); // 100 in-lb: within 25 % of 101, not of 43 or 144
    expect(offered(await runnerProps(shop, jobId, wheelId))).toEqual([
      'Test click 20–200 in-lb at 43 lbf-in (verify first)',
      'Test click 20–200 in-lb at 101 lbf-in',
      'Test click 20–200 in-lb at 144 lbf-in (verify first)',
      'Test click 20–200 in-lb at 144 lbf-in (verify first)',
    ]);
    // 144 × 0.75 = 108: a check at exactly 108 in-lb counts for the 144 in-lb passes.
    await verify(shop, wrench.id, 108);
    expect(offered(await runnerProps(shop, jobId, wheelId)).slice(2)).toEqual([
      'Test click 20–200 in-lb at 144 lbf-in',
      'Test click 20–200 in-lb at 144 lbf-in',
    ]);

    await updateShopSettings(shop.lead, { verification: { nearPercent: 0 } });
    expect(offered(await runnerProps(shop, jobId, wheelId))[0]).toBe(
      'Test click 20–200 in-lb at 43 lbf-in',
    );
  });

  it("recency is counted in the shop's days: yesterday's check counts under 'within 2 days', not 'same day'; a failed one never", async () => {
    const shop = await createTestShop();
    const { jobId, wheelId, wrench } = await wheelFor(shop);
    await updateShopSettings(shop.lead, {
      timeZone: 'America/Denver',
      verification: { nearPercent: 0 },
    });
    const now = new Date();
    // Noon on the shop's previous calendar day, in Denver.
    const yesterday = new Date(
      startOfShopDay(addDays(shopDay(now, 'America/Denver'), -1), 'America/Denver').getTime() +
        12 * 3_600_000,
    );
    const row = {
      shopId: shop.shopId,
      wrenchId: wrench.id,
      referenceValue: 100,
      readingValue: 100,
      unit: 'lbf-in' as const,
      deviationPct: 0,
      tolerancePct: 4,
      recordedById: shop.technician.userId,
    };
    await getDb()
      .insert(wrenchVerifications)
      .values([
        { ...row, withinTolerance: true, recordedAt: yesterday },
        { ...row, withinTolerance: false, readingValue: 90, deviationPct: -10, recordedAt: now },
      ]);
    expect(offered(await runnerProps(shop, jobId, wheelId), now)[1]).toMatch(/\(verify first\)$/);

    await updateShopSettings(shop.lead, { verification: { recency: 'within_days', days: 2 } });
    expect(offered(await runnerProps(shop, jobId, wheelId), now)[1]).toBe(
      'Test click 20–200 in-lb at 101 lbf-in',
    );

    await updateShopSettings(shop.lead, { verification: { days: 1 } });
    expect(offered(await runnerProps(shop, jobId, wheelId), now)[1]).toMatch(/\(verify first\)$/);
  });
});
