import { torquePlanRequestSchema } from '@/features/plans/schemas';
import { computePlan } from '@/features/plans/server/compute-plan';
import { apiRoute } from '@/server/http/handler';

// The tool crib arrives with the shop records; until then no id belongs to any shop.
const noCrib = async () => [];

export const POST = apiRoute({ permission: 'plans.compute', body: torquePlanRequestSchema }, async ({ body }) => ({
  data: await computePlan(body, noCrib),
}));
