import { specSchema } from '@/features/specs/schemas';
import { createSpec, listSpecs } from '@/features/specs/server/specs';
import { apiRoute } from '@/server/http/handler';
import { pageOf, pageQuery } from '@/server/http/paginate';

export const GET = apiRoute(
  { permission: 'board.view', query: pageQuery },
  async ({ member, query }) => pageOf(await listSpecs(member.shopId), query),
);

export const POST = apiRoute(
  { permission: 'specs.manage', body: specSchema, status: 201 },
  async ({ member, body }) => ({ data: await createSpec(member, body) }),
);
