import type { ReactNode } from 'react';
import { QueryProvider } from '@/features/ui/query-provider';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';
import { getCurrentMember } from '@/server/auth/session';
import { getShopSettings } from '@/server/shop/settings';

/**
 * Full screen for the runner: no shop header, the phone's whole height for the work. The shop's
 * clock comes from its settings; signed out, the page itself sends the person to sign-in (and
 * back), so the layout neither redirects nor guesses a zone. The runner's outbox and its pulls of
 * the wheel's events run on TanStack Query, hence its provider here.
 */
export default async function RunnerLayout({ children }: { children: ReactNode }) {
  const member = await getCurrentMember();
  if (!member) return <QueryProvider>{children}</QueryProvider>;
  const { timeZone } = await getShopSettings(member.shopId);
  return (
    <ShopTimeZoneProvider timeZone={timeZone}>
      <QueryProvider>{children}</QueryProvider>
    </ShopTimeZoneProvider>
  );
}
