'use client';

import { memo } from 'react';
import { BoltCircle, LIST_FROM } from '@/features/bolt-circle/bolt-circle';
import { BoltList } from '@/features/bolt-circle/bolt-list';
import type { PassProgress } from '../state';
import { Caution } from './caution';
import { OutOfSequence } from './out-of-sequence';
import { RingLayout, ringButtonClass } from './ring-layout';

// A little lower than elsewhere, so ring, setting and button share a 640 px screen.
const panelButton = ringButtonClass.replace('min-h-24', 'min-h-20');

/**
 * A pass under way: the ring, the setting in a line that stays in view, and one big button for
 * the highlighted bolt (two on a check pass: it turned, or it did not). From memory (practice) no
 * next bolt is shown: the bolt tapped is the one confirmed, right or wrong. Memoised, with
 * handlers the torque panel keeps stable: a tap redraws this and the bolts that changed.
 */
export const PassRing = memo(function PassRing({
  pass,
  name,
  boltCount,
  cautions,
  flaggedBolts,
  memory,
  word,
  settingLine,
  selected,
  onSelect,
  confirm,
  undo,
  last,
  onProblem,
}: {
  pass: PassProgress;
  /** "Pass 2 of 3" or "Check pass". */
  name: string;
  boltCount: number;
  cautions: string[];
  flaggedBolts: readonly number[];
  memory: boolean;
  word: 'Clicked' | 'Reached';
  /** "Set TW-1 to 50 ft-lb". */
  settingLine: string;
  selected: number | null;
  onSelect: (bolt: number | null) => void;
  confirm: (at: number, bolt: number, turned?: boolean) => void;
  undo: (tap: { pass: number; bolt: number }) => void;
  /** The last bolt confirmed: in this pass, or the pass before when this one has none yet. */
  last: { pass: number; bolt: number } | null;
  onProblem: () => void;
}) {
  const label = pass.kind === 'check' ? name.toLowerCase() : `pass ${pass.index}`;
  const shownNext = memory ? null : pass.next;
  // From memory a tapped bolt already done is offered for undo.
  const tapped = selected && !pass.confirmed.includes(selected) ? selected : null;
  const bolt = memory ? tapped : pass.next;
  const other = memory
    ? selected && !tapped
      ? selected
      : null
    : selected && selected !== pass.next
      ? selected
      : null;
  const question =
    word === 'Clicked'
      ? 'did it turn before the wrench clicked?'
      : 'did it turn before the wrench reached the setting?';
  return (
    <div className="flex flex-col gap-3">
      <PassCautions cautions={cautions} memory={memory} />
      <p aria-live="polite" className="text-center text-lg">
        {pass.confirmed.length} of {boltCount} bolts
        {memory ? ' · tap the bolt you would do next' : ` · next: bolt ${pass.next}`}
      </p>
      <RingLayout
        ring={
          <div
            id="pass-ring"
            className="mx-auto w-full max-w-[min(100%,calc(100dvh-22rem))] scroll-mt-32 landscape:max-w-none landscape:[&>svg]:max-h-[calc(100dvh-5rem)]"
          >
            <BoltCircle
              count={boltCount}
              order={memory ? undefined : pass.order}
              done={pass.confirmed}
              next={shownNext}
              passLabel={label}
              selected={selected}
              onSelect={onSelect}
              flagged={flaggedBolts}
              label={`Bolt circle, ${label}: ${pass.confirmed.length} of ${boltCount} done`}
            />
          </div>
        }
      >
        {boltCount >= LIST_FROM ? (
          <BoltList
            count={boltCount}
            done={pass.confirmed}
            next={shownNext}
            selected={selected}
            flagged={flaggedBolts}
            onSelect={onSelect}
          />
        ) : null}
        {other ? (
          <OutOfSequence
            pass={pass}
            bolt={other}
            confirm={confirm}
            undo={(b) => {
              undo({ pass: pass.index, bolt: b });
              onSelect(null);
            }}
          />
        ) : null}
        {/* Sticky in portrait: the setting and the button stay in view however far the page scrolls. */}
        <div className="border-paper-line bg-paper z-10 flex flex-col gap-2 border-t-2 pt-2 pb-1 portrait:sticky portrait:bottom-0">
          <p
            aria-label="Current setting"
            className="bg-work-tint text-work-dark rounded-lg px-2 py-1 text-center text-lg font-black"
          >
            {name} · {settingLine}
          </p>

          {memory && !bolt ? (
            <p className="text-center text-lg font-bold">Tap the bolt you would tighten next.</p>
          ) : pass.kind === 'check' && bolt ? (
            <>
              <p className="text-center text-lg font-bold">
                Bolt {bolt}: {question}
              </p>
              <div className="grid grid-cols-2 gap-2">
                <button
                  type="button"
                  onClick={(e) => confirm(e.timeStamp, bolt, true)}
                  className={`${panelButton} bg-caution! text-caution-ink!`}
                >
                  Turned
                </button>
                <button
                  type="button"
                  onClick={(e) => confirm(e.timeStamp, bolt, false)}
                  className={panelButton}
                >
                  Didn&apos;t turn
                </button>
              </div>
            </>
          ) : (
            <button
              type="button"
              onClick={(e) => bolt && confirm(e.timeStamp, bolt)}
              className={panelButton}
            >
              {word} — bolt {bolt}
            </button>
          )}
          <div className="grid grid-cols-2 gap-2">
            <button
              type="button"
              disabled={!last}
              onClick={() => last && undo(last)}
              className="border-ink min-h-12 rounded-xl border-2 px-2 font-bold disabled:opacity-40"
            >
              Undo last bolt{last ? ` (${last.bolt})` : ''}
            </button>
            <button
              type="button"
              onClick={onProblem}
              className="border-danger text-danger min-h-12 rounded-xl border-2 px-2 font-bold"
            >
              Problem with this bolt
            </button>
          </div>
        </div>
      </RingLayout>
    </div>
  );
});

/**
 * Above the ring, so the sticky panel is the last thing on the page and never scrolls away;
 * folded, since the card before the pass showed it in full and the ring needs the room. The same
 * for the whole pass: memoised, a tap never redraws it.
 */
const PassCautions = memo(function PassCautions({
  cautions,
  memory,
}: {
  cautions: string[];
  memory: boolean;
}) {
  return cautions.length ? (
    <details className="border-caution bg-caution-tint text-caution-ink rounded-xl border-l-8 px-3">
      <summary className="min-h-touch flex cursor-pointer items-center font-black">
        ⚠ Cautions, and reading the ring
      </summary>
      <Caution items={cautions} />
      <p className="py-2 text-sm">
        {memory
          ? 'Number beside the ring: the bolt. Tap the bolt you would tighten next, then confirm it.'
          : 'Number beside the ring: the bolt. Number inside a bolt: its turn, shown for the next few. Tap a bolt to undo or correct it.'}
      </p>
    </details>
  ) : null;
});
