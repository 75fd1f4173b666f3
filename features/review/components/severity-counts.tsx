/** How many anomalies hold the job (must be acknowledged) and how many are notes; words, not colour alone. */
export function SeverityCounts({ blocks, notes }: { blocks: number; notes: number }) {
  if (!blocks && !notes)
    return (
      <span className="bg-ok-tint text-ok rounded-full px-3 py-1 text-sm font-semibold">
        No anomalies
      </span>
    );
  return (
    <span className="flex gap-2 text-sm font-semibold">
      {blocks ? (
        <span className="bg-danger-tint text-danger rounded-full px-3 py-1">
          {blocks} to acknowledge
        </span>
      ) : null}
      {notes ? (
        <span className="bg-paper-dim text-ink rounded-full px-3 py-1">
          {notes} {notes === 1 ? 'note' : 'notes'}
        </span>
      ) : null}
    </span>
  );
}
