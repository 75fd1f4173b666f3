import { listTeam } from '@/features/accounts/server/team';
import { apiRoute } from '@/server/http/handler';

export const GET = apiRoute({ permission: 'team.manage' }, async ({ member }) => ({
  data: await listTeam(member.shopId),
}));
