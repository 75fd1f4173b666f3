import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { AttemptResult } from '@/features/practice/components/attempt-result';
import { attemptId } from '@/features/practice/schemas';
import { attemptFor } from '@/features/practice/server/attempts';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { orNotFound } from '@/server/errors';

export const metadata: Metadata = { title: 'Practice result' };

export default async function PracticeResultPage({
  params,
}: PageProps<'/practice/attempts/[attemptId]/result'>) {
  const p = await params;
  const member = await requireMember('practice.run', `/practice/attempts/${p.attemptId}/result`);
  const id = attemptId.safeParse(p.attemptId);
  if (!id.success) notFound();
  const attempt = await orNotFound(attemptFor(member, id.data));
  const own = attempt.userId === member.userId;
  return (
    <>
      <PageHeader title={own ? 'Your result' : `${attempt.personName}’s result`}>
        <Link href="/practice" className="text-work font-semibold underline">
          Practice home
        </Link>
      </PageHeader>
      {attempt.result ? (
        <AttemptResult setup={attempt.setup} result={attempt.result} />
      ) : (
        <p>
          This attempt is not finished yet.{' '}
          {own ? (
            <Link href={`/practice/attempts/${attempt.id}`} className="text-work underline">
              Carry on with it
            </Link>
          ) : null}
        </p>
      )}
    </>
  );
}
