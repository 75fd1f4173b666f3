import { convertPressure, formatTorque, UNIT_LABELS, type Pressure } from '@/features/torque-plan';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { PRESSURE_TOLERANCE_PSI } from '../anomalies';
import { formatSeconds } from '../duration';
import type { WheelReview as WheelReviewData } from '../server/review-data';
import { PassReview } from './pass-review';

const shown = (p: Pressure) => `${Number(p.value.toFixed(1))} ${UNIT_LABELS[p.unit]}`;
const PHOTO_LABELS: Record<string, string> = {
  bead_outer: 'Seated bead, outer face',
  bead_inner: 'Seated bead, inner face',
  other: 'Photo',
};

/** One wheel's record as the lead reviews it: what it was judged against, measurements, photos, passes, steps. */
export function WheelReview({
  wheel,
  people,
}: {
  wheel: WheelReviewData;
  people: Record<string, string>;
}) {
  const seat = wheel.record.measurements.seat_bead;
  const set = wheel.record.measurements.leak_check;
  const seatOver = seat
    ? convertPressure(seat.value, seat.unit, wheel.maxBeadSeat.unit) >
      wheel.maxBeadSeat.value + 1e-9
    : false;
  const setOff = set
    ? Math.abs(
        convertPressure(set.value, set.unit, 'psi') -
          convertPressure(wheel.targetPressure.value, wheel.targetPressure.unit, 'psi'),
      ) >
      PRESSURE_TOLERANCE_PSI + 1e-9
    : false;
  return (
    <section
      className="border-paper-line flex flex-col gap-4 rounded-xl border-2 p-4"
      aria-labelledby={`wheel-${wheel.id}`}
    >
      <header>
        <h3 id={`wheel-${wheel.id}`} className="text-xl font-bold">
          {wheel.position} wheel · {wheel.tireSize}
        </h3>
        <p className="text-ink-soft text-sm">
          {wheel.specName}: {wheel.plan.boltCount} bolts, final {formatTorque(wheel.finalTorque, 1)}
          , bead-seating limit {shown(wheel.maxBeadSeat)}, target {shown(wheel.targetPressure)}.{' '}
          {wheel.source === 'snapshot'
            ? 'As copied onto the wheel when its run started.'
            : 'From the spec as it stands today (no snapshot: the run never started).'}
        </p>
        <p className="text-sm">
          {wheel.submittedAt ? (
            <>
              Submitted <ShopTime when={wheel.submittedAt} />.
            </>
          ) : (
            <span className="text-danger font-semibold">Not submitted.</span>
          )}
          {wheel.flaggedReason ? (
            <span className="text-danger font-semibold"> Flagged: {wheel.flaggedReason}</span>
          ) : null}
        </p>
        {wheel.rework ? (
          <p className="bg-paper-dim mt-1 rounded p-2 text-sm">
            Sent back <ShopTime when={wheel.rework.at} />: {wheel.rework.note}
          </p>
        ) : null}
      </header>

      <dl className="grid gap-2 sm:grid-cols-2">
        <div className={seatOver ? 'text-danger font-semibold' : undefined}>
          <dt className="text-ink-soft text-sm">Highest pressure to seat the bead</dt>
          <dd>
            {seat
              ? `${shown(seat)} (limit ${shown(wheel.maxBeadSeat)})${seatOver ? ' — above the limit' : ''}`
              : 'not recorded'}
          </dd>
        </div>
        <div className={setOff ? 'text-danger font-semibold' : undefined}>
          <dt className="text-ink-soft text-sm">Pressure set</dt>
          <dd>
            {set
              ? `${shown(set)} (target ${shown(wheel.targetPressure)}, ±${PRESSURE_TOLERANCE_PSI} psi)${setOff ? ' — off target' : ''}`
              : 'not recorded'}
          </dd>
        </div>
      </dl>

      <div>
        <h4 className="font-bold">Photos</h4>
        {wheel.photos.length ? (
          <ul className="flex flex-wrap gap-3">
            {wheel.photos.map((p) => (
              <li key={p.id}>
                <a
                  href={p.url}
                  target="_blank"
                  rel="noreferrer"
                  className="text-work block text-sm font-semibold underline"
                >
                  {/* eslint-disable-next-line @next/next/no-img-element -- private photos stream through our own route, not the image optimiser */}
                  <img
                    src={p.url}
                    alt={`${PHOTO_LABELS[p.kind] ?? 'Photo'}${p.note ? `: ${p.note}` : ''}`}
                    className="border-ink size-32 rounded-lg border-2 object-cover"
                  />
                  {PHOTO_LABELS[p.kind] ?? 'Photo'} (full size)
                </a>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-danger font-semibold">No photos.</p>
        )}
      </div>

      <div className="flex flex-col gap-3">
        <h4 className="font-bold">Torque passes</h4>
        {wheel.record.passes.map((pass) => (
          <PassReview
            key={pass.index}
            pass={pass}
            passCount={wheel.plan.passes.length}
            boltCount={wheel.plan.boltCount}
            uses={wheel.wrenchUses[pass.index] ?? []}
            people={people}
          />
        ))}
      </div>

      <div>
        <h4 className="font-bold">Steps</h4>
        <table className="w-full text-left text-sm">
          <thead>
            <tr>
              <th scope="col">Step</th>
              <th scope="col">Outcome</th>
              <th scope="col">Finished</th>
              <th scope="col">Took</th>
              <th scope="col">By</th>
            </tr>
          </thead>
          <tbody>
            {wheel.record.steps.map((s) => (
              <tr key={s.id} className={s.status === 'skipped' ? 'bg-paper-dim' : undefined}>
                <td>{s.title}</td>
                <td>
                  {s.status === 'done'
                    ? 'Done'
                    : s.status === 'skipped'
                      ? `Skipped: ${s.reason}`
                      : 'Not done'}
                </td>
                <td>{s.at ? <ShopTime when={s.at} style="time" /> : '—'}</td>
                <td>{s.seconds === null ? '—' : formatSeconds(s.seconds)}</td>
                <td>{s.byId ? (people[s.byId] ?? 'unknown') : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>

      {wheel.refused.length ? (
        <div>
          <h4 className="font-bold">Entries the server refused</h4>
          <ul className="list-disc pl-5 text-sm">
            {wheel.refused.map((r, i) => (
              <li key={r.clientId ?? i}>
                <ShopTime when={r.at} />: {r.type ?? 'an entry'} — {r.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}
