import { memo } from 'react';
import type { AttentionItem, OthersWaiting } from '../api/use-run-queue';
import type { ClientEvent } from '../events';

/** One line a technician recognises for an event: what they tapped. */
function describe(e: ClientEvent): string {
  // Kinds added later read as their name.
  switch (e.type) {
    case 'bolt_confirmed':
      return `Bolt ${e.payload.bolt}, pass ${e.payload.pass}`;
    case 'bolt_undone':
      return `Undo bolt ${e.payload.bolt}, pass ${e.payload.pass}`;
    case 'wrench_chosen':
      return `Wrench chosen for pass ${e.payload.pass}`;
    case 'hand_started':
    case 'hand_unstarted':
      return `Hand start, bolt ${e.payload.bolt}`;
    case 'step_done':
    case 'step_skipped':
      return `Step: ${e.payload.step.replace('_', ' ')}`;
    case 'inspection_failed':
      return 'Inspection failed';
    default:
      return (e as { type: string }).type.replaceAll('_', ' ');
  }
}

/**
 * Events the server refused for good, kept on this phone with the reason (the lead sees the same
 * list on the review), and other people's confirmations waiting on this phone for their owner.
 */
export const NeedsAttention = memo(function NeedsAttention({
  items,
  others,
  onDismiss,
}: {
  items: AttentionItem[];
  others: OthersWaiting[];
  onDismiss: () => void;
}) {
  if (!items.length && !others.length) return null;
  return (
    <section
      aria-label="Needs attention"
      className="border-danger bg-danger-tint text-danger rounded-xl border-4 p-3"
    >
      <h2 className="text-lg font-black">Needs attention</h2>
      {others.map((o) => (
        <p key={o.ownerName} className="font-semibold">
          {o.waiting} {o.waiting === 1 ? 'confirmation' : 'confirmations'} by {o.ownerName} wait on
          this phone; they are sent only when {o.ownerName} signs in here again.
        </p>
      ))}
      {items.length ? (
        <>
          <p className="font-semibold">Not saved — redo these if they still need doing:</p>
          <ul className="ml-5 list-disc">
            {items.map((i) => (
              <li key={i.event.clientId}>
                {describe(i.event)}: {i.reason}
              </li>
            ))}
          </ul>
          <button
            type="button"
            onClick={onDismiss}
            className="min-h-touch border-danger mt-2 inline-flex items-center rounded-lg border-2 px-3 font-bold"
          >
            I have dealt with these
          </button>
        </>
      ) : null}
    </section>
  );
});
