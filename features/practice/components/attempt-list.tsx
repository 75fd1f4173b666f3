import Link from 'next/link';
import { ShopTime } from '@/features/ui/shop-time-zone';
import { LEVEL_NAMES, type ProgressAttempt } from '../progress';

/** Attempts, newest first: when (shop's clock), level, the shop's spec or a surprise ring, score. */
export function AttemptList({
  attempts,
  showPerson,
}: {
  attempts: ProgressAttempt[];
  showPerson: boolean;
}) {
  if (attempts.length === 0) return <p className="text-ink-soft">No attempts yet.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Practice attempts, newest first</caption>
        <thead>
          <tr className="border-ink border-b-2">
            <th scope="col" className="p-2">
              Started
            </th>
            {showPerson ? (
              <th scope="col" className="p-2">
                Who
              </th>
            ) : null}
            <th scope="col" className="p-2">
              Level
            </th>
            <th scope="col" className="p-2">
              Wheel
            </th>
            <th scope="col" className="p-2 text-right">
              Score
            </th>
          </tr>
        </thead>
        <tbody>
          {attempts.map((a) => (
            <tr key={a.id} className="border-paper-line border-b">
              <td className="p-2">
                <ShopTime when={a.startedAt.toISOString()} />
              </td>
              {showPerson ? <td className="p-2">{a.personName}</td> : null}
              <td className="p-2">{LEVEL_NAMES[a.level]}</td>
              <td className="p-2">
                {a.source === 'surprise' ? 'Surprise ring' : `Spec: ${a.ringName}`}
              </td>
              <td className="p-2 text-right tabular-nums">
                {a.score === null ? (
                  <span className="text-ink-soft">not finished</span>
                ) : (
                  <Link
                    href={`/practice/attempts/${a.id}/result`}
                    className="text-work font-semibold underline"
                  >
                    {a.score}
                    <span className="sr-only"> out of 100, see the result</span>
                  </Link>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
