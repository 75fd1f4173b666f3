import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { MailboxList } from '@/features/mailbox/components/mailbox-list';
import { requireMember } from '@/server/auth/guard';
import { listShopMail, mailboxEnabled, mailboxIsDemo } from '@/server/mail/mailbox';

export const metadata: Metadata = { title: 'Mailbox (development)', robots: { index: false } };
export const dynamic = 'force-dynamic';

// It exists while mail goes to the local sink (never in production unless MAILBOX_DEMO=true)
// and stands in for the inboxes of the people a lead invites: invite links in it let anyone who
// reads them join, so only a lead (who may invite anyway) sees it, and only their own shop's mail.
export default async function MailboxPage() {
  if (!mailboxEnabled()) notFound();
  const member = await requireMember('team.manage', '/mailbox');
  return <MailboxList messages={await listShopMail(member.shopId)} demo={mailboxIsDemo()} />;
}
