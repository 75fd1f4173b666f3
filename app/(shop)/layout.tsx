import type { ReactNode } from 'react';
import { ShopHeader } from '@/features/accounts/components/shop-header';
import { getShopName } from '@/features/accounts/server/shop';
import { SignoffNavLink } from '@/features/review/components/signoff-nav-link';
import { QueryProvider } from '@/features/ui/query-provider';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';
import { ToastRegion } from '@/features/ui/toasts';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { mailboxEnabled } from '@/server/mail/mailbox';
import { getShopSettings } from '@/server/shop/settings';

// The header needs the member; each page still calls requireMember itself, since a layout
// does not re-run on every navigation and is not an authorisation boundary.
export default async function ShopLayout({ children }: { children: ReactNode }) {
  const member = await requireMember();
  const [shopName, settings] = await Promise.all([
    getShopName(member.shopId),
    getShopSettings(member.shopId),
  ]);
  return (
    <ShopTimeZoneProvider timeZone={settings.timeZone}>
      <ShopHeader
        member={member}
        shopName={shopName}
        mailbox={mailboxEnabled() && can(member.role, 'team.manage')}
        signoff={
          can(member.role, 'jobs.signoff') ? (
            <QueryProvider>
              <SignoffNavLink />
            </QueryProvider>
          ) : null
        }
      />
      {/* Action results toast here as well as inline; the runner's layout has no ToastRegion. */}
      <ToastRegion>
        <main className="mx-auto w-full max-w-5xl p-4">{children}</main>
      </ToastRegion>
    </ShopTimeZoneProvider>
  );
}
