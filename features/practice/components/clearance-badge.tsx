import { ShopTime } from '@/features/ui/shop-time-zone';
import type { ApprenticeStanding } from '../server/clearances';

/** One line for the Team page: cleared for real wheels (by whom, when) or practice only. */
export function ClearanceBadge({ standing }: { standing: ApprenticeStanding }) {
  const latest = standing.history[0];
  if (standing.cleared && latest)
    return (
      <span className="text-ok font-semibold">
        Cleared for real wheels by {latest.clearedBy},{' '}
        <ShopTime when={latest.clearedAt.toISOString()} style="date" />
      </span>
    );
  return (
    <span className="text-ink-soft font-semibold">
      Practice only: not cleared for real wheels
      {standing.unfinishedJobs > 0
        ? ` (still holds ${standing.unfinishedJobs} job card${standing.unfinishedJobs === 1 ? '' : 's'})`
        : ''}
    </span>
  );
}
