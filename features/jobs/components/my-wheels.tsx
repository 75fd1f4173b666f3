import Link from 'next/link';
import { EmptyState } from '@/features/ui/page';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { POSITION_LABELS } from '../schemas';
import type { MyWheel, MyWheelStatus } from '../server/my-wheels';

const STATUS: Record<MyWheelStatus, { text: string; className: string }> = {
  sent_back: { text: 'Sent back', className: 'bg-danger text-white' },
  in_progress: { text: 'In progress', className: 'bg-work text-white' },
  open: { text: 'Not started', className: 'border-2 border-ink-soft text-ink' },
  stopped: { text: 'Stopped: a lead must look', className: 'bg-caution text-caution-ink' },
};

/**
 * A technician's next wheels, each one tap from its runner. Server-rendered: the first HTML
 * already holds every runner link, so a phone on a weak signal can start before any script runs.
 */
export function MyWheels({ wheels }: { wheels: MyWheel[] }) {
  if (wheels.length === 0) {
    return (
      <EmptyState title="No wheels waiting for you">
        When a lead assigns you a job card, its wheels appear here in the order to do them.{' '}
        <Link href="/board" className="text-work font-semibold underline">
          Open the board
        </Link>
      </EmptyState>
    );
  }
  return (
    <ol className="flex flex-col gap-3" aria-label="Wheels to do, next first">
      {wheels.map((w) => {
        const status = STATUS[w.status];
        return (
          <li key={w.wheelId}>
            <Link
              href={`/jobs/${w.jobId}/wheels/${w.wheelId}/run`}
              className="min-h-touch border-ink hover:bg-paper-dim flex flex-col gap-1 rounded-xl border-2 p-4 focus-visible:outline-4"
            >
              <span className="flex flex-wrap items-center justify-between gap-2">
                <span className="text-work text-xl font-black underline">
                  Job #{w.jobNumber} · {POSITION_LABELS[w.position]}
                </span>
                <span className={`rounded-md px-2 py-0.5 text-sm font-bold ${status.className}`}>
                  {status.text}
                </span>
              </span>
              <span className="font-semibold">
                {w.customer} · {w.vehicle}
              </span>
              <span>
                Tire {w.tireSize} · Spec {w.specName}
              </span>
              {w.reworkNote ? (
                <span className="text-danger font-semibold">Lead’s note: {w.reworkNote}</span>
              ) : null}
              <span className="text-ink-soft text-sm">
                {w.dueAt ? (
                  <>
                    Due <ShopTime when={w.dueAt} />
                  </>
                ) : (
                  'No due time'
                )}
              </span>
            </Link>
          </li>
        );
      })}
    </ol>
  );
}
