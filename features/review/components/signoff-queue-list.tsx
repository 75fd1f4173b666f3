'use client';

import Link from 'next/link';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { useSignoffQueue } from '../api/get-signoff-queue';
import type { SignoffQueue } from '../server/signoff-queue';
import { SeverityCounts } from './severity-counts';

/** The job cards awaiting sign-off, oldest first; refreshed with the nav's count. */
export function SignoffQueueList({ initial }: { initial: SignoffQueue }) {
  const { data = initial } = useSignoffQueue(initial);
  if (!data.jobs.length)
    return <p className="bg-paper-dim rounded-lg p-4">No job card is waiting for sign-off.</p>;
  return (
    <ol
      className="divide-paper-line border-paper-line divide-y rounded-lg border"
      aria-label="Job cards awaiting sign-off, oldest first"
    >
      {data.jobs.map((job) => (
        <li key={job.id} className="flex flex-wrap items-center justify-between gap-3 p-3">
          <div>
            <Link href={`/jobs/${job.id}/review`} className="text-work text-lg font-bold underline">
              Job {job.number} · {job.customerName}
            </Link>
            <p className="text-ink-soft text-sm">
              {job.vehicleLabel} · {job.assigneeName ?? 'unassigned'} · waiting since{' '}
              <ShopTime when={job.awaitingSince} />
            </p>
          </div>
          <SeverityCounts blocks={job.blocks} notes={job.notes} />
        </li>
      ))}
      {data.count > data.jobs.length ? (
        <li className="p-3 text-sm">{data.count - data.jobs.length} more on the board.</li>
      ) : null}
    </ol>
  );
}
