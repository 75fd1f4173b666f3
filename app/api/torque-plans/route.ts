import { torquePlanRequestSchema } from '@/features/plans/schemas';
import { computePlan } from '@/features/plans/server/compute-plan';
import { wrenchesForEngine } from '@/features/tool-crib/server/wrenches';
import { apiRoute } from '@/server/http/handler';
import { getShopSettings } from '@/server/shop/settings';

export const POST = apiRoute(
  { permission: 'plans.compute', body: torquePlanRequestSchema },
  async ({ body, member }) => ({
    // Tool-crib ids resolve to this shop's in-service wrenches only; any other id is "not in the crib".
    // Without its own minFractionOfMax, the plan uses the shop's wrench floor.
    data: await computePlan(
      body,
      (ids) => wrenchesForEngine(member.shopId, ids),
      (await getShopSettings(member.shopId)).wrenchFloorPercent / 100,
    ),
  }),
);
