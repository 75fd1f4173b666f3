import { wrenchSchema } from '@/features/tool-crib/schemas';
import { createWrench, listWrenches } from '@/features/tool-crib/server/wrenches';
import { apiRoute } from '@/server/http/handler';
import { pageOf, pageQuery } from '@/server/http/paginate';

export const GET = apiRoute(
  { permission: 'verifications.record', query: pageQuery },
  async ({ member, query }) => pageOf(await listWrenches(member.shopId), query),
);

export const POST = apiRoute(
  { permission: 'wrenches.manage', body: wrenchSchema, status: 201 },
  async ({ member, body }) => ({ data: await createWrench(member, body) }),
);
