import { z } from 'zod';
import { wrenchIdField, wrenchSchema } from '@/features/tool-crib/schemas';
import { getWrench, updateWrench } from '@/features/tool-crib/server/wrenches';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ wrenchId: wrenchIdField });

export const GET = apiRoute(
  { permission: 'verifications.record', params },
  async ({ member, params }) => ({ data: await getWrench(member.shopId, params.wrenchId) }),
);

export const PATCH = apiRoute(
  { permission: 'wrenches.manage', params, body: wrenchSchema },
  async ({ member, params, body }) => ({
    data: await updateWrench(member, params.wrenchId, body),
  }),
);
