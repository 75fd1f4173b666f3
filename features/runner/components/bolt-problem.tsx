'use client';

import { useState, type ReactNode } from 'react';
import { BOLT_PROBLEMS, type BoltProblem } from '../event-constants';
import type { RunEvent } from '../events';

const WORDS: Record<BoltProblem, string> = {
  stripped: 'Stripped thread',
  snapped: 'Snapped head',
  cross_threaded: 'Cross-threaded',
  spins: 'Bolt spins, never tightens',
  other: 'Something else',
};

const big = 'min-h-14 w-full rounded-xl px-4 text-lg font-bold';

/**
 * "Problem with this bolt": what is wrong, an optional note, and the wheel stops, flagged for a
 * lead with the bolt marked on the circle. A damaged bolt or thread is never torqued past.
 */
export type PhotoSlotFor = (onAdded: (photoId: string) => void) => ReactNode;

export function BoltProblemForm({
  bolt,
  pass,
  record,
  onCancel,
  photoSlot,
}: {
  bolt: number;
  pass?: number;
  record: (e: RunEvent) => Promise<void>;
  onCancel: () => void;
  /** An optional photo of the bolt (the runner hands an upload slot down). */ photoSlot?: PhotoSlotFor;
}) {
  const [photoId, setPhotoId] = useState<string | null>(null);
  const [problem, setProblem] = useState<BoltProblem | null>(null);
  const [note, setNote] = useState('');
  const needsNote = problem === 'other' && note.trim().length < 3;
  return (
    <section
      aria-label={`Problem with bolt ${bolt}`}
      className="border-danger bg-danger-tint flex flex-col gap-2 rounded-xl border-4 p-3"
    >
      <p className="text-danger text-lg font-black">Problem with bolt {bolt}</p>
      <fieldset className="flex flex-col gap-2">
        <legend className="font-semibold">What is wrong?</legend>
        {BOLT_PROBLEMS.map((p) => (
          <label
            key={p}
            className="border-paper-line flex min-h-14 items-center gap-3 rounded-xl border-2 bg-white px-3 text-lg"
          >
            <input
              type="radio"
              name="bolt-problem"
              className="size-7 shrink-0"
              checked={problem === p}
              onChange={() => setProblem(p)}
            />
            {WORDS[p]}
          </label>
        ))}
      </fieldset>
      <label htmlFor="bolt-problem-note" className="font-semibold">
        Note {problem === 'other' ? '(say what is wrong)' : '(optional)'}
      </label>
      <input
        id="bolt-problem-note"
        value={note}
        maxLength={300}
        onChange={(e) => setNote(e.target.value)}
        className="border-ink-soft min-h-14 rounded-xl border-2 bg-white px-3 text-lg"
      />
      {photoSlot ? photoSlot(setPhotoId) : null}
      <div className="grid grid-cols-2 gap-2">
        <button type="button" onClick={onCancel} className={`${big} border-ink border-2 bg-white`}>
          Cancel
        </button>
        <button
          type="button"
          disabled={!problem || needsNote}
          onClick={() =>
            problem &&
            void record({
              type: 'bolt_flagged',
              payload: {
                bolt,
                ...(pass ? { pass } : {}),
                problem,
                ...(note.trim() ? { note: note.trim() } : {}),
                ...(photoId ? { photoId } : {}),
              },
            })
          }
          className={`${big} bg-danger text-white disabled:opacity-40`}
        >
          Stop the wheel and flag it
        </button>
      </div>
    </section>
  );
}
