import type { ReactNode } from 'react';
import { ShopHeader } from '@/features/accounts/components/shop-header';
import { getShopName } from '@/features/accounts/server/shop';
import { requireMember } from '@/server/auth/guard';
import { mailboxEnabled } from '@/server/mail/mailbox';

// The header needs the member; each page still calls requireMember itself, since a layout
// does not re-run on every navigation and is not an authorisation boundary.
export default async function ShopLayout({ children }: { children: ReactNode }) {
  const member = await requireMember();
  return (
    <>
      <ShopHeader member={member} shopName={await getShopName(member.shopId)} mailbox={mailboxEnabled()} />
      <main className="mx-auto w-full max-w-5xl p-4">{children}</main>
    </>
  );
}
