import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { MailboxList } from '@/features/mailbox/components/mailbox-list';
import { listSinkMessages, mailboxEnabled } from '@/server/mail/mailbox';

export const metadata: Metadata = { title: 'Mailbox (development)', robots: { index: false } };
export const dynamic = 'force-dynamic';

// Development only: it exists while mail goes to the local sink, and stands in for the
// recipients' inboxes, so it needs no sign-in. With real SMTP configured it is a 404.
export default async function MailboxPage() {
  if (!mailboxEnabled()) notFound();
  return <MailboxList messages={await listSinkMessages()} />;
}
