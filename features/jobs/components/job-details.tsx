import Link from 'next/link';
import { arrowDirection, UNIT_LABELS } from '@/features/torque-plan';
import { ShopTime } from '@/features/ui/shop-time-zone';
import type { JobCard } from '../server/jobs';
import { STATE_LABELS } from '../transitions';
import { StateBadge } from './state-badge';

/** `label` comes with the photo from the runner's photo list (features meet in the page). */
type Thumb = { id: string; kind: string; note: string; url: string; label: string };

export function JobDetails({
  job,
  canRun = false,
  photos = {},
}: {
  job: JobCard;
  canRun?: boolean;
  photos?: Record<string, Thumb[]>;
}) {
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-3">
        <StateBadge state={job.state} />
        <span>{job.assignee ? `Assigned to ${job.assignee.name}` : 'Not assigned yet'}</span>
        {job.dueAt ? (
          <span>
            · due <ShopTime when={job.dueAt} />
          </span>
        ) : null}
      </div>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Customer</dt>
        <dd>
          {job.customer.name}
          {job.customer.phone ? ` · ${job.customer.phone}` : ''}
          {job.customer.email ? ` · ${job.customer.email}` : ''}
        </dd>
        <dt className="font-semibold">Vehicle</dt>
        <dd>
          {job.vehicle.label}
          {job.vehicle.vin
            ? ` · VIN ${job.vehicle.vin}${job.vehicle.vinCheckOverridden ? ' (check digit accepted by a lead)' : ''}`
            : ''}
        </dd>
        <dt className="font-semibold">Work</dt>
        <dd>
          {[
            job.dismount ? 'dismount old tire' : 'no dismount',
            job.reinstall ? 're-install on the vehicle' : 'no re-install',
          ].join(' · ')}
        </dd>
        {job.notes ? (
          <>
            <dt className="font-semibold">Notes</dt>
            <dd className="whitespace-pre-wrap">{job.notes}</dd>
          </>
        ) : null}
      </dl>
      {job.warnings?.length ? (
        <div
          role="status"
          className="border-caution bg-caution-tint text-caution-ink rounded-lg border-l-8 p-3"
        >
          {job.warnings.map((w) => (
            <p key={w}>{w}</p>
          ))}
        </div>
      ) : null}
      <section aria-labelledby="wheels-heading">
        <h2 id="wheels-heading" className="mb-2 text-xl font-bold">
          Wheels
        </h2>
        <ul className="grid gap-3 sm:grid-cols-2">
          {job.wheels.map((w) => (
            <li key={w.id} className="border-paper-line rounded-xl border-2 p-3">
              <p className="font-bold">
                {w.position} · {w.specName}
              </p>
              <p>
                {w.tireSize} · {w.targetPressure} {UNIT_LABELS[w.pressureUnit]}
              </p>
              {w.directional ? (
                <p className="text-sm">Directional: {arrowDirection(w.position).instruction}</p>
              ) : null}
              {photos[w.id]?.length ? (
                <div className="mt-2 flex flex-wrap gap-2">
                  {photos[w.id]!.map((p) => (
                    <a key={p.id} href={p.url} target="_blank" rel="noreferrer">
                      {/* eslint-disable-next-line @next/next/no-img-element -- evidence served by the upload service */}
                      <img
                        src={p.url}
                        alt={`${p.label}${p.note ? `: ${p.note}` : ''}`}
                        className="border-ink size-20 rounded-lg border-2 object-cover"
                      />
                    </a>
                  ))}
                </div>
              ) : null}
              {w.submittedAt ? (
                <p className="text-ok mt-1 font-semibold">
                  ✓ Submitted <ShopTime when={w.submittedAt} />
                </p>
              ) : null}
              {w.specFlag ? (
                <p
                  role="alert"
                  className="border-danger bg-danger-tint text-danger mt-1 rounded border-l-4 p-2 font-semibold"
                >
                  ■ This wheel&apos;s spec is flagged; the runner will not start it until a lead
                  corrects the spec: {w.specFlag}
                </p>
              ) : null}
              {w.flaggedReason ? (
                <p
                  role="alert"
                  className="border-danger bg-danger-tint text-danger mt-1 rounded border-l-4 p-2 font-semibold"
                >
                  ■ Stopped for a lead (a failed inspection or a bolt problem): {w.flaggedReason}
                </p>
              ) : null}
              {canRun &&
              !w.submittedAt &&
              (job.state === 'open' || job.state === 'in_progress' || job.state === 'sent_back') ? (
                <Link
                  href={`/jobs/${job.id}/wheels/${w.id}/run`}
                  className="min-h-touch bg-work mt-2 inline-flex items-center rounded-lg px-4 font-bold text-white"
                >
                  Run this wheel
                </Link>
              ) : null}
            </li>
          ))}
        </ul>
      </section>
      <section aria-labelledby="history-heading">
        <h2 id="history-heading" className="mb-2 text-xl font-bold">
          History
        </h2>
        <ol className="flex flex-col gap-1">
          {job.events.map((e, i) => (
            <li key={i}>
              <ShopTime when={e.at} /> — {e.by}:{' '}
              {e.fromState ? `${STATE_LABELS[e.fromState]} → ` : 'created, '}
              {STATE_LABELS[e.toState]}
              {e.selfSignoff
                ? ` — signed off their own work (single-lead setting). Reason: “${e.note}”`
                : e.note
                  ? ` (“${e.note}”)`
                  : ''}
              {e.wheels?.length ? (
                <ul className="ml-4 list-disc">
                  {e.wheels.map((w) => (
                    <li key={w.wheelId}>
                      {job.wheels.find((x) => x.id === w.wheelId)?.position ?? 'Wheel'}: {w.note}
                      {w.steps.length ? ` (redo: ${w.steps.join(', ')})` : ''}
                    </li>
                  ))}
                </ul>
              ) : null}
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
