import { z } from 'zod';
import { clearSchema, wrenchIdField } from '@/features/tool-crib/schemas';
import { clearWrench } from '@/features/tool-crib/server/wrenches';
import { apiRoute } from '@/server/http/handler';

export const POST = apiRoute(
  {
    permission: 'wrenches.clear',
    params: z.object({ wrenchId: wrenchIdField }),
    body: clearSchema,
  },
  async ({ member, params, body }) => ({
    data: await clearWrench(member, params.wrenchId, body.reason),
  }),
);
