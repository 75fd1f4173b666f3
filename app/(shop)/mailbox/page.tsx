import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { MailboxList } from '@/features/mailbox/components/mailbox-list';
import { ShopTimeZoneProvider } from '@/features/ui/shop-time-zone';
import { getCurrentMember } from '@/server/auth/session';
import { listSinkMessages, mailboxEnabled } from '@/server/mail/mailbox';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'Mailbox (development)', robots: { index: false } };
export const dynamic = 'force-dynamic';

// Development only: it exists while mail goes to the local sink, and stands in for the
// recipients' inboxes, so it needs no sign-in. With real SMTP configured it is a 404.
export default async function MailboxPage() {
  if (!mailboxEnabled()) notFound();
  // Read on the signed-in shop's clock, like the rest of the app; signed out there is no shop,
  // so the universal clock (never labelled as such on screen).
  const member = await getCurrentMember();
  const timeZone = member ? (await getShopSettings(member.shopId)).timeZone : 'UTC';
  return (
    <ShopTimeZoneProvider timeZone={timeZone}>
      <MailboxList messages={await listSinkMessages()} />
    </ShopTimeZoneProvider>
  );
}
