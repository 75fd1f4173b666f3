'use client';

import { useState } from 'react';

type Props = {
  count: number;
  done: readonly number[];
  next?: number | null;
  selected?: number | null;
  flagged?: readonly number[];
  onSelect: (bolt: number) => void;
  /** What "done" means here: "done" in a pass, "started" at hand-start. */
  doneWord?: string;
};

/**
 * The taps for a big ring (32–64 bolts), one quarter at a time: on a 360 px phone the circle's
 * bolts sit closer than a fingertip, so each bolt here gets a button at least 44 px square.
 * The quarter holding the next bolt opens first.
 */
export function BoltList({
  count,
  done,
  next = null,
  selected = null,
  flagged,
  onSelect,
  doneWord = 'done',
}: Props) {
  const perQuarter = Math.ceil(count / 4);
  const quarterOf = (b: number) => Math.floor((b - 1) / perQuarter);
  const [quarter, setQuarter] = useState<number | null>(null);
  const shown = quarter ?? (next ? quarterOf(next) : 0);
  const bolts = Array.from({ length: count }, (_, i) => i + 1).filter(
    (b) => quarterOf(b) === shown,
  );
  return (
    <details className="border-paper-line rounded-xl border-2 p-2">
      <summary className="min-h-touch flex cursor-pointer items-center font-semibold">
        Tap a bolt (list, by quarter)
      </summary>
      <div role="group" aria-label="Quarter of the ring" className="mt-2 grid grid-cols-4 gap-2">
        {[0, 1, 2, 3].map((q) => (
          <button
            key={q}
            type="button"
            aria-pressed={q === shown}
            onClick={() => setQuarter(q)}
            className={`min-h-touch rounded-lg border-2 font-bold ${q === shown ? 'border-ink bg-ink text-white' : 'border-ink-soft'}`}
          >
            {q * perQuarter + 1}–{Math.min(count, (q + 1) * perQuarter)}
          </button>
        ))}
      </div>
      <div className="mt-2 grid grid-cols-4 gap-2">
        {bolts.map((b) => {
          const isDone = done.includes(b);
          const words = [
            isDone ? doneWord : b === next ? 'next' : null,
            flagged?.includes(b) ? 'problem flagged' : null,
          ]
            .filter(Boolean)
            .join(', ');
          return (
            <button
              key={b}
              type="button"
              aria-label={`bolt ${b}${words ? `, ${words}` : ''}`}
              aria-pressed={selected === b}
              onClick={() => onSelect(b)}
              className={`min-h-touch min-w-touch rounded-lg border-2 text-lg font-bold ${flagged?.includes(b) ? 'border-danger text-danger' : isDone ? 'border-ok bg-ok text-white' : b === next ? 'border-work bg-work text-white' : 'border-ink-soft'} ${selected === b ? 'outline-ink outline-2 outline-offset-2 outline-dashed' : ''}`}
            >
              {isDone ? '✓ ' : ''}
              {b}
            </button>
          );
        })}
      </div>
    </details>
  );
}
