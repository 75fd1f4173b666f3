import type { Metadata } from 'next';
import { HydrationBoundary } from '@tanstack/react-query';
import Link from 'next/link';
import { Suspense } from 'react';
import { Board } from '@/features/jobs/components/board';
import { prefetchBoard } from '@/features/jobs/server/board-prefetch';
import { listAssignees } from '@/features/jobs/server/jobs';
import { buttonClass } from '@/features/ui/button';
import { EmptyState, PageHeader } from '@/features/ui/page';
import { QueryProvider } from '@/features/ui/query-provider';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Board' };

export default async function BoardPage({ searchParams }: PageProps<'/board'>) {
  const member = await requireMember('board.view');
  if (!can(member.role, 'jobs.view')) {
    return (
      <>
        <PageHeader title="Board" />
        <EmptyState title="Job cards are for leads and technicians">
          Apprentices practise the procedure on simulated wheels:{' '}
          <Link href="/practice" className="text-work font-semibold underline">
            go to Practice
          </Link>
          .
        </EmptyState>
      </>
    );
  }
  const canCreate = can(member.role, 'jobs.create');
  const defaultAssignee = member.role === 'technician' ? 'me' : undefined;
  // The first page is read here, so the first HTML holds the cards; the browser keeps it live.
  const [people, firstPage] = await Promise.all([
    listAssignees(member.shopId),
    prefetchBoard(member, await searchParams, defaultAssignee),
  ]);
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
        <HydrationBoundary state={firstPage}>
          <Suspense fallback={<p>Loading job cards…</p>}>
            <Board people={people} defaultAssignee={defaultAssignee} canCreate={canCreate} />
          </Suspense>
        </HydrationBoundary>
      </QueryProvider>
    </>
  );
}
