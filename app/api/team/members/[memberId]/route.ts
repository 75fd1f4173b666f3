import { z } from 'zod';
import { memberIdField, roleField } from '@/features/accounts/schemas';
import { changeRole, getTeamMember, removeMember } from '@/features/accounts/server/team';
import { apiRoute } from '@/server/http/handler';

const params = z.object({ memberId: memberIdField });

export const GET = apiRoute({ permission: 'team.manage', params }, async ({ member, params }) => ({
  data: await getTeamMember(member.shopId, params.memberId),
}));

export const PATCH = apiRoute(
  { permission: 'team.manage', params, body: z.object({ role: roleField }) },
  async ({ member, params, body }) => ({
    data: await changeRole(member, params.memberId, body.role),
  }),
);

export const DELETE = apiRoute(
  { permission: 'team.manage', params },
  async ({ member, params }) => {
    await removeMember(member, params.memberId);
    return new Response(null, { status: 204 });
  },
);
