import type { ReactNode } from 'react';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';
import { getCurrentMember } from '@/server/auth/session';
import { getShopSettings } from '@/server/shop/settings';

/**
 * Full screen for the runner: no shop header, the phone's whole height for the work. The shop's
 * clock comes from its settings; signed out, the page itself sends the person to sign-in (and
 * back), so the layout neither redirects nor guesses a zone. No Query provider: the runner's
 * network (TanStack Query) has a client of its own, loaded after the first paint
 * (features/runner/api/run-sender.ts), so it is not in the runner's first load.
 */
export default async function RunnerLayout({ children }: { children: ReactNode }) {
  const member = await getCurrentMember();
  if (!member) return children;
  const { timeZone } = await getShopSettings(member.shopId);
  return <ShopTimeZoneProvider timeZone={timeZone}>{children}</ShopTimeZoneProvider>;
}
