/** How many anomalies hold the job (must be acknowledged) and how many are notes; words, not colour alone. */
export function SeverityCounts({ blocks, notes }: { blocks: number; notes: number }) {
  if (!blocks && !notes) return <span className="rounded-full bg-ok-tint px-3 py-1 text-sm font-semibold text-ok">No anomalies</span>;
  return (
    <span className="flex gap-2 text-sm font-semibold">
      {blocks ? <span className="rounded-full bg-danger-tint px-3 py-1 text-danger">{blocks} to acknowledge</span> : null}
      {notes ? <span className="rounded-full bg-paper-dim px-3 py-1 text-ink">{notes} {notes === 1 ? 'note' : 'notes'}</span> : null}
    </span>
  );
}
