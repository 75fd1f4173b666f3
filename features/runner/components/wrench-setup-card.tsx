'use client';

import { useEffect, useRef, useState } from 'react';
import { UNIT_LABELS, type Torque } from '@/features/torque-plan';
import type { CribWrench } from '../wrench-gate';

/** The wrench and setting the apprentice chose for a pass (practice, wrench-setup level). */
export type TypedSetting = { wrenchId: string; setting: Torque };

/**
 * Practice at the wrench-setup level: instead of being told, the apprentice picks the wrench from
 * the crib on offer and types the setting in that wrench's units, then says "Wrench set". Nothing
 * is judged here; the score explains it afterwards, as a lead would.
 */
export function WrenchSetupCard({
  passName,
  wrenches,
  chosenId,
  onSet,
}: {
  passName: string;
  wrenches: readonly CribWrench[];
  chosenId: string | null;
  onSet: (typed: TypedSetting) => void;
}) {
  const ref = useRef<HTMLElement>(null);
  const [wrenchId, setWrenchId] = useState(chosenId ?? '');
  const [value, setValue] = useState('');
  const wrench = wrenches.find((w) => w.id === wrenchId) ?? null;
  const number = Number(value.replace(',', '.'));
  const valid = wrench !== null && value.trim() !== '' && Number.isFinite(number) && number > 0;
  useEffect(() => {
    ref.current?.scrollIntoView?.({ block: 'start' });
  }, [passName]);
  return (
    <section
      ref={ref}
      aria-label="Wrench setting"
      className="border-work bg-work-tint flex scroll-mt-32 flex-col gap-3 rounded-2xl border-4 p-4"
    >
      <p className="text-work-dark text-lg font-bold">{passName}</p>
      <p className="font-semibold">
        Pick the wrench you would use for this pass and type the setting you would dial in, in that
        wrench&apos;s units.
      </p>
      <label className="flex flex-col gap-1 font-semibold">
        Wrench
        <select
          value={wrenchId}
          onChange={(e) => setWrenchId(e.target.value)}
          className="border-ink-soft min-h-14 rounded-xl border-2 bg-white px-2 text-lg"
        >
          <option value="">Choose a wrench…</option>
          {wrenches.map((w) => (
            <option key={w.id} value={w.id}>
              {w.label}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 font-semibold">
        Setting{wrench ? ` (${UNIT_LABELS[wrench.unit]})` : ''}
        <input
          inputMode="decimal"
          value={value}
          onChange={(e) => setValue(e.target.value)}
          className="border-ink-soft min-h-14 rounded-xl border-2 bg-white px-2 text-lg"
        />
      </label>
      <button
        type="button"
        disabled={!valid}
        onClick={() =>
          wrench && onSet({ wrenchId: wrench.id, setting: { value: number, unit: wrench.unit } })
        }
        className="bg-work active:bg-work-dark min-h-24 w-full rounded-2xl px-4 text-2xl font-black text-white disabled:opacity-40"
      >
        Wrench set
      </button>
    </section>
  );
}
