import type { JobStateName } from '../schemas';
import { STATE_LABELS } from '../transitions';

// Each state has its own word and mark, so colour is never the only cue.
const STYLE: Record<JobStateName, { mark: string; className: string }> = {
  open: { mark: '○', className: 'border-ink bg-paper text-ink' },
  in_progress: { mark: '◐', className: 'border-work bg-work-tint text-work-dark' },
  awaiting_signoff: { mark: '◆', className: 'border-caution-ink bg-caution-tint text-caution-ink' },
  signed_off: { mark: '✓', className: 'border-ok bg-ok-tint text-ok' },
  sent_back: { mark: '↩', className: 'border-danger bg-danger-tint text-danger' },
};

export function StateBadge({ state }: { state: JobStateName }) {
  const s = STYLE[state];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded-full border-2 px-2.5 py-0.5 text-sm font-bold whitespace-nowrap ${s.className}`}
    >
      <span aria-hidden>{s.mark}</span>
      <span>{STATE_LABELS[state]}</span>
    </span>
  );
}
