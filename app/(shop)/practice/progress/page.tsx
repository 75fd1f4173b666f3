import type { Metadata } from 'next';
import Link from 'next/link';
import { ProgressView } from '@/features/practice/components/progress-view';
import { getProgress } from '@/features/practice/server/progress';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'Practice progress' };

export default async function PracticeProgressPage() {
  const member = await requireMember('practice.run', '/practice/progress');
  const progress = await getProgress(member);
  return (
    <>
      <PageHeader title="Practice progress">
        <Link href="/practice" className="text-work font-semibold underline">
          Practice home
        </Link>
      </PageHeader>
      <ProgressView progress={progress} />
    </>
  );
}
