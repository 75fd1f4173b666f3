import { ShopTime } from '@/features/ui/shop-time-zone';
import type { ApprenticeStanding } from '../server/clearances';

/** Whether the apprentice may run real wheels, who said so and when, and what was revoked. */
export function ClearanceStatus({ standing }: { standing: ApprenticeStanding }) {
  const [latest, ...earlier] = standing.history;
  return (
    <div className="flex flex-col gap-2">
      {standing.cleared && latest ? (
        <p className="border-ok bg-ok-tint text-ok rounded-lg border-2 p-2 font-semibold">
          Cleared for real wheels by {latest.clearedBy},{' '}
          <ShopTime when={latest.clearedAt.toISOString()} />
          {latest.note ? <span className="text-ink block font-normal">“{latest.note}”</span> : null}
        </p>
      ) : (
        <p className="border-ink-soft rounded-lg border-2 p-2 font-semibold">
          Not cleared for real wheels: practice only.
        </p>
      )}
      {!standing.cleared && standing.unfinishedJobs > 0 ? (
        <p
          role="note"
          className="border-caution bg-caution-tint text-caution-ink rounded-lg border-2 p-2"
        >
          Still assigned to {standing.unfinishedJobs} job card
          {standing.unfinishedJobs === 1 ? '' : 's'} with wheels to run. The runner refuses{' '}
          {standing.name} until a lead clears them again: reassign those job cards.
        </p>
      ) : null}
      {(standing.cleared ? earlier : standing.history).length ? (
        <details>
          <summary className="cursor-pointer text-sm font-semibold">Earlier clearances</summary>
          <ul className="text-ink-soft mt-1 text-sm">
            {(standing.cleared ? earlier : standing.history).map((r) => (
              <li key={r.id}>
                Cleared by {r.clearedBy}, <ShopTime when={r.clearedAt.toISOString()} />
                {r.revokedAt ? (
                  <>
                    ; revoked by {r.revokedBy ?? 'a former member'},{' '}
                    <ShopTime when={r.revokedAt.toISOString()} />
                  </>
                ) : null}
              </li>
            ))}
          </ul>
        </details>
      ) : null}
    </div>
  );
}
