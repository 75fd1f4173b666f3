import { ShopTime } from '@/features/ui/shop-time-zone';

export type Decision = { action: string; by: string; at: string; note: string };

/** The last sign-off or send-back on the job, read from its history: what a lead sees after deciding. */
export function LatestDecision({ decision }: { decision: Decision | null }) {
  if (!decision) return null;
  const signed = decision.action === 'sign_off';
  return (
    <p
      role="status"
      className={`rounded-lg border-2 p-3 ${signed ? 'border-ok bg-ok-tint' : 'border-ink bg-paper-dim'}`}
    >
      <strong>{signed ? 'Signed off' : 'Sent back'}</strong> by {decision.by},{' '}
      <ShopTime when={decision.at} />
      {decision.note ? (
        <span className="mt-1 block text-sm whitespace-pre-wrap">{decision.note}</span>
      ) : null}
    </p>
  );
}
