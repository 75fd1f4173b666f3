import type { Metadata } from 'next';
import { reviewSources } from '@/app/_review/sources';
import { SignoffQueueList } from '@/features/review/components/signoff-queue-list';
import { getSignoffQueue } from '@/features/review/server/signoff-queue';
import { PageHeader } from '@/features/ui/page';
import { QueryProvider } from '@/features/ui/query-provider';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'Sign-off' };

export default async function SignoffPage() {
  const member = await requireMember('jobs.signoff', '/signoff');
  const queue = await getSignoffQueue(member.shopId, reviewSources);
  return (
    <>
      <PageHeader title="Sign-off" />
      <p className="text-ink-soft mb-4">
        Job cards waiting for a lead, oldest first. Open one to review its record, then sign it off
        or send wheels back.
      </p>
      <QueryProvider>
        <SignoffQueueList initial={queue} />
      </QueryProvider>
    </>
  );
}
