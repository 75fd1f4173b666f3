'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';
import { UNIT_LABELS, type TorqueUnit } from '@/features/torque-plan';
import { buttonClass } from '@/features/ui/button';
import { startPracticeAttempt } from '../actions/practice-actions';
import { PRACTICE_LEVELS, type PracticeLevel } from '../types';

export type PracticeSpecOption = {
  id: string;
  name: string;
  boltCount: number;
  finalTorque: number;
  torqueUnit: TorqueUnit;
};

const LEVELS: Record<PracticeLevel, { name: string; sentence: string }> = {
  guided: {
    name: 'Guided',
    sentence:
      'The runner shows the tightening sequence and the wrench setting, as it does on the job.',
  },
  from_memory: {
    name: 'From memory',
    sentence: 'No turn numbers on the bolt circle: tap the bolt you would tighten next.',
  },
  wrench_setup: {
    name: 'Wrench setup',
    sentence: 'Pick the wrench and type its setting for each pass; the score says if it suits.',
  },
};

const SURPRISE = 'surprise';

/** Start an attempt: one of the shop's specs or a random ring, at one of three levels. */
export function StartAttemptForm({ specs }: { specs: PracticeSpecOption[] }) {
  const router = useRouter();
  const [ring, setRing] = useState<string>(SURPRISE);
  const [level, setLevel] = useState<PracticeLevel>('guided');
  const [error, setError] = useState<string | null>(null);
  const [pending, start] = useTransition();

  const submit = () =>
    start(async () => {
      setError(null);
      const result = await startPracticeAttempt(
        null,
        ring === SURPRISE ? { source: 'surprise', level } : { source: 'spec', specId: ring, level },
      );
      if (result.ok) router.push(`/practice/attempts/${result.data.id}`);
      else setError(result.message);
    });

  return (
    <form
      className="flex flex-col gap-5"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <label className="flex flex-col gap-1 font-semibold">
        Wheel
        <select
          value={ring}
          onChange={(e) => setRing(e.target.value)}
          className="border-ink-soft min-h-touch rounded-lg border-2 bg-white px-2"
        >
          <option value={SURPRISE}>Surprise me (a random ring)</option>
          {specs.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name} · {s.boltCount} bolts · {s.finalTorque} {UNIT_LABELS[s.torqueUnit]}
            </option>
          ))}
        </select>
      </label>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Level</legend>
        {PRACTICE_LEVELS.map((l) => (
          <label
            key={l}
            className="border-paper-line has-[:checked]:border-work min-h-touch flex items-start gap-3 rounded-lg border-2 p-3"
          >
            <input
              type="radio"
              name="level"
              value={l}
              checked={level === l}
              onChange={() => setLevel(l)}
              className="mt-1 size-5"
            />
            <span>
              <span className="font-bold">{LEVELS[l].name}</span>
              <span className="block">{LEVELS[l].sentence}</span>
            </span>
          </label>
        ))}
      </fieldset>
      {error ? (
        <p
          role="alert"
          className="border-danger bg-danger-tint text-danger rounded-lg border-2 p-3"
        >
          {error}
        </p>
      ) : null}
      <button type="submit" disabled={pending} className={buttonClass('primary', 'self-start')}>
        {pending ? 'Starting…' : 'Start the attempt'}
      </button>
    </form>
  );
}
