import { z } from 'zod';
import { specIdField, specSchema } from '@/features/specs/schemas';
import { getSpec, updateSpec } from '@/features/specs/server/specs';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ specId: specIdField });

export const GET = apiRoute({ permission: 'board.view', params }, async ({ member, params }) => ({
  data: await getSpec(member.shopId, params.specId),
}));

export const PATCH = apiRoute(
  { permission: 'specs.manage', params, body: specSchema },
  async ({ member, params, body }) => ({
    data: await updateSpec(member, params.specId, body),
  }),
);
