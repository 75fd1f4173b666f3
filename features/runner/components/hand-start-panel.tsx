'use client';

import { useState } from 'react';
import { BoltCircle, LIST_FROM } from '@/features/bolt-circle/bolt-circle';
import { BoltList } from '@/features/bolt-circle/bolt-list';
import type { RunEvent } from '../events';
import type { PhotoSlotFor } from './bolt-problem';
import { Caution } from './caution';
import { BoltProblemForm } from './lazy-parts';
import { RingLayout, ringButtonClass } from './ring-layout';
import { SpecWordsBox, type SpecWords } from './spec-words';

/**
 * Every bolt started by hand, across the ring: after the first bolt past the valve notch the
 * suggested next one is opposite it, then the quarters, so the ring is drawn down evenly. Tap a
 * bolt on the circle to mark or unmark it out of that order.
 */
export function HandStartPanel({
  boltCount,
  started,
  next,
  cautions,
  record,
  specWords,
  flaggedBolts = [],
  photoSlot,
}: {
  boltCount: number;
  started: number[];
  /** The suggested next bolt (the reducer's `nextHandStart`), null once all are started. */
  next: number | null;
  cautions: string[];
  record: (e: RunEvent) => Promise<void>;
  specWords?: SpecWords;
  flaggedBolts?: readonly number[];
  photoSlot?: PhotoSlotFor;
}) {
  const [problem, setProblem] = useState(false);
  const toggle = (bolt: number) =>
    void record({
      type: started.includes(bolt) ? 'hand_unstarted' : 'hand_started',
      payload: { bolt },
    });
  if (problem)
    return (
      <BoltProblemForm
        bolt={next ?? started.at(-1) ?? 1}
        record={record}
        onCancel={() => setProblem(false)}
        photoSlot={photoSlot}
      />
    );
  return (
    <div className="flex flex-col gap-4">
      <SpecWordsBox words={specWords} />
      <Caution items={cautions} />
      <RingLayout
        ring={
          <BoltCircle
            count={boltCount}
            done={started}
            next={next}
            mode="hand-start"
            onSelect={toggle}
            flagged={flaggedBolts}
            label={`Hand-start: ${started.length} of ${boltCount} bolts started`}
          />
        }
      >
        <p aria-live="polite" className="text-center text-lg">
          {started.length} of {boltCount} started{next ? ` · next: bolt ${next}` : ''}
        </p>
        {boltCount >= LIST_FROM ? (
          <BoltList
            count={boltCount}
            done={started}
            next={next}
            flagged={flaggedBolts}
            onSelect={toggle}
            doneWord="started"
          />
        ) : null}
        {next ? (
          <>
            <p className="text-center font-semibold">Press the ring down to start the next bolt.</p>
            <button type="button" onClick={() => toggle(next)} className={ringButtonClass}>
              Bolt {next} started by hand
            </button>
          </>
        ) : (
          <button
            type="button"
            onClick={() =>
              void record({ type: 'step_done', payload: { step: 'hand_start', checklist: [] } })
            }
            className="bg-work min-h-16 w-full rounded-xl px-4 text-lg font-bold text-white"
          >
            All bolts started — step done
          </button>
        )}
        <button
          type="button"
          onClick={() => setProblem(true)}
          className="border-danger text-danger min-h-14 rounded-xl border-2 px-2 font-bold"
        >
          Problem with this bolt
        </button>
      </RingLayout>
    </div>
  );
}
