'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Runner, type RunnerProps } from '@/features/runner/components/runner';
import { postPracticeEvents } from '../api/post-practice-events';
import type { PracticeLevel } from '../types';

type Info = { waiting: number; unfinished: string[]; early: boolean };

/** Ends the attempt: the server scores what it has stored, so it waits for this phone to send everything. */
function FinishAttempt({ attemptId, waiting, unfinished, early }: Info & { attemptId: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const finish = async () => {
    if (early && !window.confirm(`End the attempt now? Not finished: ${unfinished.join(', ')}.`))
      return;
    setBusy(true);
    setError(null);
    const res = await fetch(`/api/practice/attempts/${attemptId}/finish`, {
      method: 'POST',
    }).catch(() => null);
    if (res?.ok) return router.push(`/practice/attempts/${attemptId}/result`);
    const body = (await res?.json().catch(() => null)) as { error?: { message: string } } | null;
    setError(body?.error?.message ?? 'No connection: try Finish again in a moment.');
    setBusy(false);
  };
  const disabled = busy || waiting > 0;
  if (early)
    return (
      <button
        type="button"
        onClick={() => void finish()}
        disabled={disabled}
        className="border-work-dark min-h-touch rounded-lg border-2 bg-white px-3 font-bold disabled:opacity-40"
      >
        End attempt
      </button>
    );
  return (
    <div className="flex flex-col gap-3">
      <p className="text-lg">
        {unfinished.length
          ? `Not finished: ${unfinished.join(', ')}. Finish now and the score says what was left.`
          : 'Every step is done. Finish to see your score and each mistake explained.'}
      </p>
      {waiting ? (
        <p role="status">
          {waiting} confirmation{waiting === 1 ? '' : 's'} still waiting on this phone to be saved.
        </p>
      ) : null}
      {error ? (
        <p role="alert" className="text-danger font-bold">
          {error}
        </p>
      ) : null}
      <button
        type="button"
        onClick={() => void finish()}
        disabled={disabled}
        className="bg-work min-h-16 w-full rounded-xl px-4 text-lg font-bold text-white disabled:opacity-40"
      >
        {busy ? 'Scoring…' : 'Finish'}
      </button>
    </div>
  );
}

/**
 * The real runner on a simulated wheel: same steps, cautions and checklists; the events go to the
 * attempt (the outbox is keyed by the attempt's id, never a wheel's), photos are optional, and it
 * ends with Finish and the score instead of Submit.
 */
export function PracticeRunner({
  attemptId,
  level,
  ...props
}: Omit<RunnerProps, 'practice' | 'saveEvents'> & { attemptId: string; level: PracticeLevel }) {
  return (
    <Runner
      {...props}
      saveEvents={postPracticeEvents}
      practice={{
        level,
        eventsUrl: `/api/practice/attempts/${attemptId}/events`,
        back: { href: '/practice', label: 'Practice' },
        finish: (info) => <FinishAttempt attemptId={attemptId} {...info} />,
      }}
    />
  );
}
