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

/** The arrow rule in one line for paper; the runner shows the full instruction at the mount step. */
function directionText(w: PrintedWheel): string {
  if (!w.directional) return 'not directional';
  const arrow = arrowDirection(w.position);
  return arrow.side
    ? `directional: seen from outside, the arrow turns ${arrow.seenFromOutside} (${arrow.side} side)`
    : 'directional: side not known yet, check the arrow when it goes on the vehicle';
}

// The job's facts two to a row, to leave the sheet to the wheels: four fit one sheet of A4 or Letter.
const pairs = 'grid grid-cols-[max-content_1fr_max-content_1fr] gap-x-3';

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
      <dl className={`mt-1 ${pairs}`}>
        <dt className="font-semibold">Customer</dt>
        <dd>
          {job.customer.name}
          {job.customer.phone ? ` · ${job.customer.phone}` : ''}
        </dd>
        <dt className="font-semibold">Due</dt>
        <dd>{job.dueAt ? <ShopTime when={job.dueAt} /> : 'No due date'}</dd>
        <dt className="font-semibold">Vehicle</dt>
        <dd>
          {job.vehicle.label}
          {job.vehicle.vin ? ` · VIN ${job.vehicle.vin}` : ''}
        </dd>
        <dt className="font-semibold">Assigned to</dt>
        <dd>{job.assignee?.name ?? 'Not assigned yet'}</dd>
        <dt className="font-semibold">Work</dt>
        <dd className="col-span-3">
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
      <ul className="mt-3 flex flex-col gap-2">
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
    <article
      aria-labelledby={`print-wheel-${w.id}`}
      className="border-ink flex items-start gap-3 rounded-lg border-2 p-2 text-xs"
    >
      <div className="min-w-0 flex-1">
        <h3 id={`print-wheel-${w.id}`} className="text-base font-black">
          {w.position} · {label}
        </h3>
        <dl className="grid grid-cols-[max-content_1fr] gap-x-3">
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
            {w.tireSize} · {directionText(w)}
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
      </div>
      <div
        role="img"
        aria-label={`QR code: opens the runner for the ${label.toLowerCase()} wheel`}
        className="size-30 shrink-0 [&>svg]:size-full"
        // The library's own SVG (paths only): it carries the runner's address and nothing else.
        dangerouslySetInnerHTML={{ __html: w.qrSvg }}
      />
    </article>
  );
}
