'use client';

import { useEffect, useMemo, useRef, useState } from 'react';
import { BoltCircle, LIST_FROM } from '@/features/bolt-circle/bolt-circle';
import { BoltList } from '@/features/bolt-circle/bolt-list';
import {
  formatTorque,
  UNIT_LABELS,
  type RecordedVerification,
  type Torque,
} from '@/features/torque-plan';
import { tapCounts } from '../double-tap';
import type { RunEvent } from '../events';
import type { PassProgress, RunnerState } from '../state';
import type { PassPractice } from '../practice-mode';
import { useRunnerSettings } from '../settings-store';
import { passWrench, type CribWrench, type WrenchRules } from '../wrench-gate';
import { BoltProblemForm, type PhotoSlotFor } from './bolt-problem';
import { Caution } from './caution';
import { RingLayout, ringButtonClass } from './ring-layout';
import { SettingCard } from './setting-card';
import { SpecWordsBox, type SpecWords } from './spec-words';
import { VerifyAskOthers, VerifyInline } from './verify-inline';
import { WrenchSetupCard, type TypedSetting } from './wrench-setup-card';

const big = 'min-h-16 w-full rounded-xl px-4 text-lg font-bold';
// A little lower than elsewhere, so ring, setting and button share a 640 px screen.
const panelButton = ringButtonClass.replace('min-h-24', 'min-h-20');

function cue(text: string, speak: boolean, vibrate: boolean) {
  if (vibrate && 'vibrate' in navigator) navigator.vibrate(40);
  if (speak && 'speechSynthesis' in window) {
    window.speechSynthesis.cancel();
    window.speechSynthesis.speak(new SpeechSynthesisUtterance(text));
  }
}

/** What the big button says: a click wrench clicks; a beam, dial or digital wrench is read until it reaches the setting. */
export function confirmWord(kind: CribWrench['kind'] | undefined): 'Clicked' | 'Reached' {
  return kind === 'click' || kind === undefined ? 'Clicked' : 'Reached';
}

/** "Pass 2 of 3" or "Check pass" (then "Check pass 2" for each one a turned bolt added). */
export function passName(pass: PassProgress, passes: readonly PassProgress[]): string {
  if (pass.kind === 'check') {
    const n = passes.filter((p) => p.kind === 'check' && p.index <= pass.index).length;
    return n > 1 ? `Check pass ${n}` : 'Check pass';
  }
  return `Pass ${pass.index} of ${passes.filter((p) => p.kind === 'staged').length}`;
}

/**
 * One pass at a time. A full-width card says which wrench to set to what, and must be
 * acknowledged before the first bolt; then the ring, the setting in a line that stays in view,
 * and one big button for the highlighted bolt (two on a check pass: it turned, or it did not).
 */
export function TorquePanel({
  state,
  targets,
  wrenches,
  verifications,
  rules,
  mayRecordVerifications = false,
  cautions,
  boltCount,
  record,
  specWords,
  flaggedBolts = [],
  photoSlot,
  practice,
}: {
  state: RunnerState;
  targets: Torque[];
  wrenches: CribWrench[];
  verifications: RecordedVerification[];
  rules: WrenchRules;
  /** Lead and technician only: anyone else is told to ask one of them (deny by default). */
  mayRecordVerifications?: boolean;
  cautions: string[];
  boltCount: number;
  record: (e: RunEvent) => Promise<void>;
  /** The spec's own words, shown with the first pass's setting. */
  specWords?: SpecWords;
  flaggedBolts?: readonly number[];
  photoSlot?: PhotoSlotFor;
  /** Practice mode (a simulated wheel): see RunnerPractice. */
  practice?: PassPractice;
}) {
  const { speak, vibrate } = useRunnerSettings();
  // Verifications recorded on this phone since the page loaded, judged like the server's.
  const [fresh, setFresh] = useState<RecordedVerification[]>([]);
  const [failed, setFailed] = useState<string[]>([]);
  const [selected, setSelected] = useState<number | null>(null);
  // Settings acknowledged on this phone ("Wrench set"): pass, wrench and setting. Device-only:
  // after a reload the card shows again, which costs one tap and misses nothing.
  const [acked, setAcked] = useState<string[]>([]);
  const [problem, setProblem] = useState(false);
  // Practice, wrench-setup level: what the apprentice chose and typed, per pass (device-only, like `acked`).
  const [typed, setTyped] = useState<Record<number, TypedSetting>>({});
  const memory = practice?.level === 'from_memory';
  const setup = practice?.level === 'wrench_setup';
  const lastTap = useRef<number | null>(null);
  const index = state.currentPass;
  const pass = index ? (state.passes[index - 1] ?? null) : null;
  // A check pass added because a bolt turned is at the final target, like the plan's last pass.
  const target = index ? (targets[index - 1] ?? targets.at(-1) ?? null) : null;
  const allVerifications = useMemo(() => [...fresh, ...verifications], [fresh, verifications]);
  const gate = target
    ? passWrench({
        target,
        wrenches,
        failed,
        chosenId: pass?.wrenchId,
        rules,
        verifications: allVerifications,
        now: new Date(),
      })
    : null;
  const { best = null, suitable = [], wrench = null, choice = null } = gate ?? {};
  // Practice records no verification (nothing touches the tool crib): its gate is not asked.
  const verification = practice ? null : (gate?.verification ?? null);

  useEffect(() => {
    if (pass?.next && speak && !memory) cue(`Bolt ${pass.next}`, speak, false);
  }, [pass?.next, speak, memory]);

  if (!pass || !target) {
    return (
      <div className="flex flex-col gap-4">
        <p className="border-ok bg-ok-tint text-ok rounded-xl border-2 p-4 text-lg font-bold">
          Every pass is done, check pass included.
        </p>
        <button
          type="button"
          onClick={() =>
            void record({ type: 'step_done', payload: { step: 'torque', checklist: [] } })
          }
          className={`${big} bg-work text-white`}
        >
          Torque passes done
        </button>
      </div>
    );
  }

  const name = passName(pass, state.passes);
  const label = pass.kind === 'check' ? name.toLowerCase() : `pass ${pass.index}`;
  const mine = setup ? (typed[pass.index] ?? null) : null;
  const used = setup
    ? mine && { wrench: wrenches.find((w) => w.id === mine.wrenchId)!, setting: mine.setting }
    : wrench && choice?.ok
      ? { wrench, setting: choice.setting }
      : null;
  const settingText = used ? `${used.setting.value} ${UNIT_LABELS[used.setting.unit]}` : null;
  const ackKey =
    wrench && choice?.ok
      ? `${pass.index}|${wrench.id}|${choice.setting.value}|${choice.setting.unit}`
      : null;
  const word = confirmWord(used?.wrench.kind);
  const big32 = boltCount >= LIST_FROM;

  // `at`: the tap's own time stamp (the event's), so two taps are compared on one clock.
  const confirm = (at: number, bolt: number, turned?: boolean) => {
    const now = at;
    if (!tapCounts(lastTap.current, now)) return;
    lastTap.current = now;
    // What was used, as shown at this moment: the wrench and its setting travel with the bolt.
    const withWrench = used ? { wrenchId: used.wrench.id, setting: used.setting } : {};
    void record({
      type: 'bolt_confirmed',
      payload: {
        pass: pass.index,
        bolt,
        ...withWrench,
        ...(turned === undefined ? {} : { turned }),
      },
    });
    cue(`Bolt ${bolt} done`, false, vibrate);
    setSelected(null);
  };
  // The last bolt confirmed: in this pass, or the pass before when this one has none yet.
  const previous = state.passes[pass.index - 2];
  const last = pass.confirmed.length
    ? { pass: pass.index, bolt: pass.confirmed.at(-1)! }
    : previous?.confirmed.length
      ? { pass: previous.index, bolt: previous.confirmed.at(-1)! }
      : null;

  if (problem) {
    return (
      <BoltProblemForm
        bolt={selected ?? pass.next ?? 1}
        pass={pass.index}
        record={record}
        onCancel={() => setProblem(false)}
        photoSlot={photoSlot}
      />
    );
  }

  if (setup && !mine) {
    return (
      <div className="flex flex-col gap-4">
        <WrenchSetupCard
          key={pass.index}
          passName={`${name}: ${formatTorque(target, 2)}`}
          wrenches={wrenches}
          chosenId={pass.wrenchId}
          onSet={(t) => {
            setTyped((all) => ({ ...all, [pass.index]: t }));
            void record({
              type: 'wrench_chosen',
              payload: { pass: pass.index, wrenchId: t.wrenchId },
            });
          }}
        />
        {pass.index === 1 ? <SpecWordsBox words={specWords} /> : null}
        <Caution items={cautions} />
      </div>
    );
  }

  if (!used || !settingText) {
    return (
      <div className="flex flex-col gap-4">
        <p className="text-lg font-bold">
          {name}: {formatTorque(target, 2)}
        </p>
        <p role="alert" className="text-danger font-bold">
          {best && !best.ok ? best.reason : 'No in-service wrench suits this pass.'}
        </p>
      </div>
    );
  }

  if (wrench && choice?.ok && verification && !verification.counts) {
    return (
      <div className="flex flex-col gap-4">
        <p className="text-lg font-bold">
          {name}: {formatTorque(target, 2)} · {wrench.label} at {settingText}
        </p>
        {mayRecordVerifications ? (
          <VerifyInline
            wrench={wrench}
            setting={choice.setting}
            why={verification.reason}
            onResult={(recorded) =>
              recorded.withinTolerance
                ? setFresh((v) => [recorded, ...v])
                : setFailed((f) => [...f, wrench.id])
            }
          />
        ) : (
          <VerifyAskOthers wrench={wrench} why={verification.reason} />
        )}
      </div>
    );
  }

  if (!setup && wrench && choice?.ok && ackKey && !acked.includes(ackKey)) {
    return (
      <div className="flex flex-col gap-4">
        <SettingCard
          passName={`${name}: ${formatTorque(target, 2)}`}
          wrench={wrench.label}
          setting={settingText}
          warnings={choice.warnings}
          onSet={() => {
            setAcked((a) => [...a, ackKey]);
            // The wrench in hand is recorded once per pass (a later "Wrench set" after a reload
            // finds it chosen): the save path then takes this pass's bolts on its quick path.
            if (pass.wrenchId !== wrench.id)
              void record({
                type: 'wrench_chosen',
                payload: { pass: pass.index, wrenchId: wrench.id },
              });
            // Bring the ring up under the header: ring, setting and button on one screen.
            setTimeout(() => {
              document.getElementById('pass-ring')?.scrollIntoView?.({ block: 'start' });
            }, 0);
          }}
        >
          {suitable.length > 1 ? (
            <label className="flex flex-col gap-1 font-semibold">
              Wrench
              <select
                value={wrench.id}
                onChange={(e) =>
                  void record({
                    type: 'wrench_chosen',
                    payload: { pass: pass.index, wrenchId: e.target.value },
                  })
                }
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
        {pass.index === 1 ? <SpecWordsBox words={specWords} /> : null}
        <Caution items={cautions} />
      </div>
    );
  }

  // From memory: no next bolt is shown; the bolt tapped is the one confirmed (right or wrong), and
  // a tapped bolt already done is offered for undo.
  const shownNext = memory ? null : pass.next;
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
      {/* Above the ring, so the sticky panel is the last thing on the page and never scrolls away;
          folded, since the card before the pass showed it in full and the ring needs the room. */}
      {cautions.length ? (
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
      ) : null}
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
              onSelect={setSelected}
              flagged={flaggedBolts}
              label={`Bolt circle, ${label}: ${pass.confirmed.length} of ${boltCount} done`}
            />
          </div>
        }
      >
        {big32 ? (
          <BoltList
            count={boltCount}
            done={pass.confirmed}
            next={shownNext}
            selected={selected}
            flagged={flaggedBolts}
            onSelect={setSelected}
          />
        ) : null}
        {other ? (
          pass.confirmed.includes(other) ? (
            <button
              type="button"
              onClick={() => {
                void record({ type: 'bolt_undone', payload: { pass: pass.index, bolt: other } });
                setSelected(null);
              }}
              className={`${big} border-ink border-2`}
            >
              Undo bolt {other}
            </button>
          ) : pass.kind === 'check' ? (
            <div className="grid grid-cols-2 gap-2">
              <button
                type="button"
                onClick={(e) => confirm(e.timeStamp, other, true)}
                className={`${big} border-caution bg-caution-tint text-caution-ink border-4`}
              >
                Bolt {other}, out of sequence: turned
              </button>
              <button
                type="button"
                onClick={(e) => confirm(e.timeStamp, other, false)}
                className={`${big} border-caution bg-caution-tint text-caution-ink border-4`}
              >
                Bolt {other}, out of sequence: didn&apos;t turn
              </button>
            </div>
          ) : (
            <button
              type="button"
              onClick={(e) => confirm(e.timeStamp, other)}
              className={`${big} border-caution bg-caution-tint text-caution-ink border-4`}
            >
              Bolt {other} is out of sequence: confirm it anyway
            </button>
          )
        ) : null}
        {/* Sticky in portrait: the setting and the button stay in view however far the page scrolls. */}
        <div className="border-paper-line bg-paper z-10 flex flex-col gap-2 border-t-2 pt-2 pb-1 portrait:sticky portrait:bottom-0">
          <p
            aria-label="Current setting"
            className="bg-work-tint text-work-dark rounded-lg px-2 py-1 text-center text-lg font-black"
          >
            {name} · Set {used.wrench.label} to {settingText}
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
              onClick={() => last && void record({ type: 'bolt_undone', payload: last })}
              className="border-ink min-h-12 rounded-xl border-2 px-2 font-bold disabled:opacity-40"
            >
              Undo last bolt{last ? ` (${last.bolt})` : ''}
            </button>
            <button
              type="button"
              onClick={() => setProblem(true)}
              className="border-danger text-danger min-h-12 rounded-xl border-2 px-2 font-bold"
            >
              Problem with this bolt
            </button>
          </div>
        </div>
      </RingLayout>
    </div>
  );
}
