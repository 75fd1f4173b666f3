import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import type { PracticeResult } from '../types';

/**
 * One pass side by side: the bolts in the order the apprentice did them, and the order expected,
 * the bolts out of order dashed on both. Each circle's bolts say their turn in words; the orders
 * are also written out under each circle.
 */
export function PassCompare({
  pass,
  label,
  boltCount,
  outOfOrder,
}: {
  pass: PracticeResult['passes'][number];
  label: string;
  boltCount: number;
  outOfOrder: number[];
}) {
  return (
    <section className="border-paper-line rounded-lg border p-3" aria-label={label}>
      <h4 className="font-bold first-letter:uppercase">{label}</h4>
      {pass.done.length < boltCount ? (
        <p className="text-danger font-semibold">
          {pass.done.length} of {boltCount} bolts done.
        </p>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <figure>
          <BoltCircle
            count={boltCount}
            order={pass.done}
            done={[]}
            mode="preview"
            passLabel={`${label}, as done`}
            marked={outOfOrder}
            label={`${label}: the order done`}
          />
          <figcaption className="text-center text-sm">
            <span className="font-semibold">
              Done{outOfOrder.length ? ' (dashed: out of order)' : ''}:
            </span>{' '}
            {pass.done.length ? pass.done.join(', ') : 'no bolts'}
          </figcaption>
        </figure>
        <figure>
          <BoltCircle
            count={boltCount}
            order={pass.expected}
            done={[]}
            mode="preview"
            passLabel={`${label}, expected`}
            marked={outOfOrder}
            label={`${label}: the order expected`}
          />
          <figcaption className="text-center text-sm">
            <span className="font-semibold">Expected:</span> {pass.expected.join(', ')}
          </figcaption>
        </figure>
      </div>
    </section>
  );
}
