import { z } from 'zod';
import { ids, wheelSchema } from '@/features/jobs/schemas';
import { getWheel, updateWheel } from '@/features/jobs/server/jobs';
import { checkbox } from '@/features/ui/form-data';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ wheelId: ids.wheel });

export const GET = apiRoute({ permission: 'jobs.view', params }, async ({ member, params }) => ({
  data: await getWheel(member.shopId, params.wheelId),
}));

export const PATCH = apiRoute(
  {
    permission: 'jobs.edit',
    params,
    body: wheelSchema.extend({ acceptAxleMismatch: checkbox.default(false) }),
  },
  async ({ member, params, body: { acceptAxleMismatch, ...wheel } }) => ({
    data: await updateWheel(member, params.wheelId, wheel, acceptAxleMismatch),
  }),
);
