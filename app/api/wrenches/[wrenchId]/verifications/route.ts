import { z } from 'zod';
import { verificationSchema, wrenchIdField } from '@/features/tool-crib/schemas';
import { recordVerification, wrenchHistory } from '@/features/tool-crib/server/wrenches';
import { apiRoute } from '@/server/http/handler';
import { pageOf, pageQuery } from '@/server/http/paginate';

const params = z.object({ wrenchId: wrenchIdField });

export const GET = apiRoute(
  { permission: 'verifications.record', params, query: pageQuery },
  async ({ member, params, query }) =>
    pageOf(await wrenchHistory(member.shopId, params.wrenchId), query),
);

export const POST = apiRoute(
  { permission: 'verifications.record', params, body: verificationSchema, status: 201 },
  async ({ member, params, body }) => ({
    data: await recordVerification(member, params.wrenchId, body),
  }),
);
