import { settingsPatchSchema } from '@/features/settings/schemas';
import { updateShopSettings } from '@/features/settings/server/settings';
import { apiRoute } from '@/server/http/handler';
import { getShopSettings } from '@/server/shop/settings';

// Every member reads the shop's rules (a technician's phone needs them); only a lead changes them.
export const GET = apiRoute({ permission: 'board.view' }, async ({ member }) => ({
  data: await getShopSettings(member.shopId),
}));

export const PATCH = apiRoute(
  { permission: 'shop.settings', body: settingsPatchSchema },
  async ({ member, body }) => ({
    data: await updateShopSettings(member, body),
  }),
);
