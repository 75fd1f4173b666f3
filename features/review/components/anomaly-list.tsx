import type { Anomaly } from '../types';

/** The anomalies, what blocks sign-off first; severity in words and shape, not colour alone. */
export function AnomalyList({ anomalies }: { anomalies: readonly Anomaly[] }) {
  if (!anomalies.length) {
    return (
      <p className="border-ok bg-ok-tint text-ok rounded-lg border-2 p-3 font-semibold">
        No anomalies: the record follows the plan, the shop&apos;s rules and the spec&apos;s limits.
      </p>
    );
  }
  return (
    <ul className="flex flex-col gap-2" aria-label="Anomalies">
      {anomalies.map((a) => (
        <li
          key={a.key}
          className={`rounded-lg border-2 p-3 ${a.severity === 'blocks' ? 'border-danger bg-danger-tint' : 'border-paper-line bg-paper-dim'}`}
          data-severity={a.severity}
        >
          <span
            className={`mr-2 inline-block rounded px-2 py-0.5 text-sm font-bold ${a.severity === 'blocks' ? 'bg-danger text-white' : 'bg-ink-soft text-white'}`}
          >
            {a.severity === 'blocks' ? '■ Blocks sign-off' : '● Note'}
          </span>
          {a.message}
        </li>
      ))}
    </ul>
  );
}
