import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import { formatTorque } from '@/features/torque-plan';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { passLabel } from '../anomalies';
import { formatSeconds } from '../duration';
import type { PassRecord } from '../record';
import type { WrenchUse } from '../anomalies';

/**
 * One pass: the bolts in the order they were confirmed on the bolt circle beside the planned
 * sequence (out-of-order bolts marked on both, and in words), the wrench and setting with its
 * verification, and each bolt's time, person and phone.
 */
export function PassReview({
  pass,
  passCount,
  boltCount,
  uses,
  people,
}: {
  pass: PassRecord;
  passCount: number;
  boltCount: number;
  uses: WrenchUse[];
  people: Record<string, string>;
}) {
  const label = passLabel(pass, passCount);
  const actual = pass.confirmed.map((c) => c.bolt);
  const marked = pass.confirmed.filter((c) => c.outOfOrder).map((c) => c.bolt);
  return (
    <section className="border-paper-line rounded-lg border p-3" aria-label={label}>
      <h4 className="font-bold first-letter:uppercase">{label}</h4>
      {!pass.complete ? (
        <p className="text-danger font-semibold">
          {pass.confirmed.length} of {boltCount} bolts confirmed.
        </p>
      ) : null}
      <ul className="my-2 text-sm">
        {uses.map((u) => (
          <li key={u.wrenchId ?? 'none'}>
            <strong>{u.label}</strong>
            {u.setting ? ` set to ${formatTorque(u.setting, 2)}` : ''} —{' '}
            {u.verifiedAt ? (
              <>
                {u.verification}, <ShopTime when={u.verifiedAt} />
              </>
            ) : (
              <span className="text-danger font-semibold">
                {u.verification || 'no verification on record'}
              </span>
            )}
          </li>
        ))}
      </ul>
      <div className="grid gap-3 sm:grid-cols-2">
        <figure>
          <BoltCircle
            count={boltCount}
            order={actual}
            done={[]}
            mode="preview"
            passLabel={label}
            marked={marked}
            label={`${label}: order confirmed`}
          />
          <figcaption className="text-center text-sm font-semibold">
            Order confirmed{marked.length ? ` (dashed: out of order)` : ''}
          </figcaption>
        </figure>
        <figure>
          <BoltCircle
            count={boltCount}
            order={pass.order}
            done={[]}
            mode="preview"
            passLabel={label}
            marked={marked}
            label={`${label}: planned sequence`}
          />
          <figcaption className="text-center text-sm font-semibold">Planned sequence</figcaption>
        </figure>
      </div>
      <details open={marked.length > 0} className="mt-2">
        <summary className="cursor-pointer font-semibold">
          Each bolt ({pass.confirmed.length})
        </summary>
        <table className="mt-2 w-full text-left text-sm">
          <thead>
            <tr>
              <th scope="col">#</th>
              <th scope="col">Bolt</th>
              <th scope="col">Plan</th>
              <th scope="col">When</th>
              <th scope="col">Gap</th>
              <th scope="col">By</th>
              <th scope="col">Phone</th>
            </tr>
          </thead>
          <tbody>
            {pass.confirmed.map((c, i) => (
              <tr
                key={c.bolt}
                className={c.outOfOrder ? 'bg-danger-tint font-semibold' : undefined}
              >
                <td>{i + 1}</td>
                <td>{c.bolt}</td>
                <td>
                  {c.outOfOrder
                    ? `out of order (plan: ${c.expected ?? '—'})`
                    : (pass.order[i] ?? '—')}
                </td>
                <td>
                  <ShopTime when={c.at} style="time" />
                </td>
                <td>{c.seconds === null ? '—' : formatSeconds(c.seconds)}</td>
                <td>{people[c.byId] ?? 'unknown'}</td>
                <td>{c.device ?? 'not recorded'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </section>
  );
}
