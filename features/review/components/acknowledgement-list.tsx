import { ShopTime } from '@/features/ui/shop-time-zone';
import type { Acknowledgement } from '../server/decide';

/** Anomalies a lead accepted at sign-off: which, why, who and when. */
export function AcknowledgementList({ acknowledgements }: { acknowledgements: Acknowledgement[] }) {
  if (!acknowledgements.length) return null;
  return (
    <section aria-labelledby="acknowledged">
      <h2 id="acknowledged" className="mb-2 text-lg font-bold">
        Acknowledged at sign-off
      </h2>
      <ul className="flex flex-col gap-2 text-sm">
        {acknowledgements.map((a, i) => (
          <li key={i} className="bg-paper-dim rounded-lg p-2">
            {a.message} <strong>Reason: {a.reason}</strong> — {a.by}, <ShopTime when={a.at} />
          </li>
        ))}
      </ul>
    </section>
  );
}
