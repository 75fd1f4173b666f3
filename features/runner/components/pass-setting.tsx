'use client';

import type { WrenchChoice } from '@/features/torque-plan';
import type { CribWrench } from '../wrench-gate';
import { Caution } from './caution';
import { SettingCard } from './setting-card';
import { SpecWordsBox, type SpecWords } from './spec-words';

/**
 * Before a pass's first bolt: the full-width "Set <wrench> to <value>" card, acknowledged with
 * "Wrench set"; another suitable wrench may be picked; the first pass shows the spec's own words.
 */
export function PassSetting({
  title,
  passIndex,
  wrench,
  setting,
  warnings,
  suitable,
  best,
  specWords,
  cautions,
  onSet,
  onPick,
}: {
  /** "Pass 1 of 3: 50 ft-lb". */
  title: string;
  passIndex: number;
  wrench: CribWrench;
  /** The setting in the wrench's own units ("48 ft-lb"). */
  setting: string;
  warnings: string[];
  suitable: CribWrench[];
  best: WrenchChoice | null;
  specWords?: SpecWords;
  cautions: string[];
  onSet: () => void;
  onPick: (wrenchId: string) => void;
}) {
  return (
    <div className="flex flex-col gap-4">
      <SettingCard
        passName={title}
        wrench={wrench.label}
        setting={setting}
        warnings={warnings}
        onSet={onSet}
      >
        {suitable.length > 1 ? (
          <label className="flex flex-col gap-1 font-semibold">
            Wrench
            <select
              value={wrench.id}
              onChange={(e) => onPick(e.target.value)}
              className="border-ink-soft min-h-14 rounded-xl border-2 bg-white px-2 text-lg"
            >
              {suitable.map((w) => (
                <option key={w.id} value={w.id}>
                  {w.label}
                  {w.id === (best?.ok ? best.wrenchId : '') ? ' (suggested)' : ''}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </SettingCard>
      {passIndex === 1 ? <SpecWordsBox words={specWords} /> : null}
      <Caution items={cautions} />
    </div>
  );
}
