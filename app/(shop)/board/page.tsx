import type { Metadata } from 'next';
import Link from 'next/link';
import { Suspense } from 'react';
import { Board } from '@/features/jobs/components/board';
import { listAssignees } from '@/features/jobs/server/jobs';
import { buttonClass } from '@/features/ui/button';
import { EmptyState, PageHeader } from '@/features/ui/page';
import { QueryProvider } from '@/features/ui/query-provider';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Board' };

export default async function BoardPage() {
  const member = await requireMember('board.view');
  if (!can(member.role, 'jobs.view')) {
    return (
      <>
        <PageHeader title="Board" />
        <EmptyState title="Job cards are for leads and technicians">
          Apprentices practise the procedure on simulated wheels; practice mode is coming to Ringpass.
        </EmptyState>
      </>
    );
  }
  const canCreate = can(member.role, 'jobs.create');
  return (
    <>
      <PageHeader title="Board">
        {canCreate ? (
          <Link href="/jobs/new" className={buttonClass()}>
            New job card
          </Link>
        ) : null}
      </PageHeader>
      <QueryProvider>
        <Suspense fallback={<p>Loading job cards…</p>}>
          <Board people={await listAssignees(member.shopId)} defaultAssignee={member.role === 'technician' ? 'me' : undefined} canCreate={canCreate} />
        </Suspense>
      </QueryProvider>
    </>
  );
}
