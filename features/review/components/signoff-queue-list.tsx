'use client';

import Link from 'next/link';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { useSignoffQueue } from '../api/get-signoff-queue';
import type { SignoffQueue } from '../server/signoff-queue';
import { SeverityCounts } from './severity-counts';

/** The job cards awaiting sign-off, oldest first; refreshed with the nav's count. */
export function SignoffQueueList({ initial }: { initial: SignoffQueue }) {
  const { data = initial } = useSignoffQueue(initial);
  if (!data.jobs.length) return <p className="rounded-lg bg-paper-dim p-4">No job card is waiting for sign-off.</p>;
  return (
    <ol className="divide-y divide-paper-line rounded-lg border border-paper-line" aria-label="Job cards awaiting sign-off, oldest first">
      {data.jobs.map((job) => (
        <li key={job.id} className="flex flex-wrap items-center justify-between gap-3 p-3">
          <div>
            <Link href={`/jobs/${job.id}/review`} className="text-lg font-bold text-work underline">
              Job {job.number} · {job.customerName}
            </Link>
            <p className="text-sm text-ink-soft">
              {job.vehicleLabel} · {job.assigneeName ?? 'unassigned'} · waiting since <ShopTime when={job.awaitingSince} />
            </p>
          </div>
          <SeverityCounts blocks={job.blocks} notes={job.notes} />
        </li>
      ))}
      {data.count > data.jobs.length ? <li className="p-3 text-sm">{data.count - data.jobs.length} more on the board.</li> : null}
    </ol>
  );
}
