'use client';

import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import type { RunEvent } from '../events';
import { Caution } from './caution';
import { RingLayout, ringButtonClass } from './ring-layout';

/** Every bolt started by hand: tap a bolt to mark or unmark it, or take them in turn clockwise. */
export function HandStartPanel({
  boltCount,
  started,
  cautions,
  record,
}: {
  boltCount: number;
  started: number[];
  cautions: string[];
  record: (e: RunEvent) => Promise<void>;
}) {
  const next =
    Array.from({ length: boltCount }, (_, i) => i + 1).find((b) => !started.includes(b)) ?? null;
  const toggle = (bolt: number) =>
    void record({
      type: started.includes(bolt) ? 'hand_unstarted' : 'hand_started',
      payload: { bolt },
    });
  return (
    <div className="flex flex-col gap-4">
      <Caution items={cautions} />
      <RingLayout
        ring={
          <BoltCircle
            count={boltCount}
            done={started}
            mode="hand-start"
            onSelect={toggle}
            label={`Hand-start: ${started.length} of ${boltCount} bolts started`}
          />
        }
      >
        <p aria-live="polite" className="text-center text-lg">
          {started.length} of {boltCount} started
        </p>
        {next ? (
          <button
            type="button"
            onClick={() => toggle(next)}
            className={ringButtonClass}
          >
            Bolt {next} started by hand
          </button>
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
      </RingLayout>
    </div>
  );
}
