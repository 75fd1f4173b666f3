import type { Metadata } from 'next';
import Link from 'next/link';
import { AttemptList } from '@/features/practice/components/attempt-list';
import { StartAttemptForm } from '@/features/practice/components/start-attempt-form';
import { listAttempts } from '@/features/practice/server/attempts';
import { practiceSpecs } from '@/features/practice/server/sources';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'Practice' };

export default async function PracticeHomePage() {
  const member = await requireMember('practice.run', '/practice');
  const [specs, attempts] = await Promise.all([
    practiceSpecs(member.shopId),
    listAttempts(member.shopId, { userId: member.userId }),
  ]);
  const open = attempts.filter((a) => a.finishedAt === null).slice(0, 5);
  return (
    <>
      <PageHeader title="Practice">
        <Link href="/practice/progress" className="text-work font-semibold underline">
          Progress
        </Link>
      </PageHeader>
      <div className="flex flex-col gap-8">
        <p className="max-w-prose">
          Run the whole procedure on a simulated wheel, on the same runner as a real one. Nothing
          here touches a job card, a wheel or the tool crib. The wheel and tire maker&apos;s specs,
          local codes and licensed practice always come first.
        </p>
        <section aria-labelledby="start" className="flex max-w-xl flex-col gap-3">
          <h2 id="start" className="text-xl font-black">
            Start an attempt
          </h2>
          <StartAttemptForm specs={specs} />
        </section>
        {open.length ? (
          <section aria-labelledby="open" className="flex flex-col gap-2">
            <h2 id="open" className="text-xl font-black">
              Carry on
            </h2>
            <ul className="flex flex-col gap-1">
              {open.map((a) => (
                <li key={a.id}>
                  <Link
                    href={`/practice/attempts/${a.id}`}
                    className="text-work min-h-touch inline-flex items-center font-semibold underline"
                  >
                    {a.source === 'surprise' ? 'Surprise ring' : a.ringName} · {a.boltCount} bolts
                  </Link>
                </li>
              ))}
            </ul>
          </section>
        ) : null}
        <section aria-labelledby="recent" className="flex flex-col gap-2">
          <h2 id="recent" className="text-xl font-black">
            Your recent attempts
          </h2>
          <AttemptList attempts={attempts.slice(0, 20)} showPerson={false} />
        </section>
      </div>
    </>
  );
}
