import {
  arrowDirection,
  formatTorque,
  threadConditionText,
  UNIT_LABELS,
} from '@/features/torque-plan';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { POSITION_LABELS } from '../schemas';
import type { JobCard } from '../server/jobs';
import type { PrintedWheel } from '../server/job-card-print';

const PATTERNS = {
  cross: () => 'cross pattern',
  skip: (step: number | null) => `skip ${step ?? '?'} pattern`,
  sequential: () => 'sequential (clockwise)',
} as const;

/**
 * The paper job card clipped to the wheels: hidden on screen, the only thing printed from the job
 * page (app/globals.css prints a page's `data-print-card` alone). One card per wheel, never split
 * across sheets, each with the code that opens its runner on the shop phone.
 */
export function JobCardPrint({ job, wheels }: { job: JobCard; wheels: PrintedWheel[] }) {
  return (
    <section
      data-print-card
      aria-labelledby="print-card-title"
      className="hidden text-sm print:block"
    >
      <h2 id="print-card-title" className="text-xl font-black">
        Job card #{job.number}
      </h2>
      <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-4">
        <dt className="font-semibold">Customer</dt>
        <dd>
          {job.customer.name}
          {job.customer.phone ? ` · ${job.customer.phone}` : ''}
        </dd>
        <dt className="font-semibold">Vehicle</dt>
        <dd>
          {job.vehicle.label}
          {job.vehicle.vin ? ` · VIN ${job.vehicle.vin}` : ''}
        </dd>
        <dt className="font-semibold">Due</dt>
        <dd>{job.dueAt ? <ShopTime when={job.dueAt} /> : 'No due date'}</dd>
        <dt className="font-semibold">Assigned to</dt>
        <dd>{job.assignee?.name ?? 'Not assigned yet'}</dd>
        <dt className="font-semibold">Work</dt>
        <dd>
          {job.dismount ? 'Dismount the old tire' : 'No dismount'} ·{' '}
          {job.reinstall ? 're-install on the vehicle' : 'no re-install'}
        </dd>
      </dl>
      <p className="border-ink mt-2 border-l-4 pl-2">
        Scan a wheel&apos;s code with the shop phone and work it step by step in the runner; this
        card is not the procedure. No air in any tire until every ring bolt&apos;s torque has been
        checked. The wheel and tire maker&apos;s specs, local codes and licensed practice come
        first.
      </p>
      <ul className="mt-3 grid grid-cols-2 gap-3">
        {wheels.map((w) => (
          <li key={w.id} className="break-inside-avoid">
            <WheelCard wheel={w} />
          </li>
        ))}
      </ul>
    </section>
  );
}

function WheelCard({ wheel: w }: { wheel: PrintedWheel }) {
  const label = POSITION_LABELS[w.position];
  return (
    <article aria-labelledby={`print-wheel-${w.id}`} className="border-ink rounded-lg border-2 p-2">
      <div className="flex items-start justify-between gap-2">
        <h3 id={`print-wheel-${w.id}`} className="text-lg font-black">
          {w.position} · {label}
        </h3>
        <div
          role="img"
          aria-label={`QR code: opens the runner for the ${label.toLowerCase()} wheel`}
          className="size-28 shrink-0 [&>svg]:size-full"
          // The library's own SVG (paths only): it carries the runner's address and nothing else.
          dangerouslySetInnerHTML={{ __html: w.qrSvg }}
        />
      </div>
      <dl className="grid grid-cols-[max-content_1fr] gap-x-2">
        <dt className="font-semibold">Spec</dt>
        <dd>{w.spec.name}</dd>
        <dt className="font-semibold">Ring bolts</dt>
        <dd>
          {w.spec.boltCount} × {w.spec.boltThread},{' '}
          {PATTERNS[w.spec.pattern.kind](w.spec.pattern.step)}
        </dd>
        <dt className="font-semibold">Final torque</dt>
        <dd className="font-bold">{formatTorque(w.spec.finalTorque)}</dd>
        <dt className="font-semibold">Threads</dt>
        <dd>{threadConditionText(w.spec.threadCondition)}</dd>
        <dt className="font-semibold">Maker ref.</dt>
        <dd>{w.spec.makerReference || 'None given in the spec'}</dd>
        <dt className="font-semibold">Tire</dt>
        <dd>
          {w.tireSize} ·{' '}
          {w.directional
            ? `directional: ${arrowDirection(w.position).instruction}`
            : 'not directional'}
        </dd>
        <dt className="font-semibold">Pressure</dt>
        <dd>
          {w.targetPressure.value} {UNIT_LABELS[w.targetPressure.unit]} target
        </dd>
      </dl>
      {w.spec.flag ? (
        <p className="border-ink mt-1 border-l-4 pl-2 font-bold">
          Spec flagged: the runner will not start this wheel until a lead corrects the spec.
        </p>
      ) : null}
    </article>
  );
}
