'use client';

import { memo, useCallback, useEffect, useMemo, useState } from 'react';
import {
  formatTorque,
  UNIT_LABELS,
  type RecordedVerification,
  type Torque,
} from '@/features/torque-plan';
import { afterPaint } from '../api/after-paint';
import type { RunEvent } from '../events';
import type { RunnerState } from '../state';
import type { PassPractice } from '../practice-mode';
import { useRunnerSettings } from '../settings-store';
import { passWrench, type CribWrench, type WrenchRules } from '../wrench-gate';
import type { PhotoSlotFor } from './bolt-problem';
import { Caution } from './caution';
import { BoltProblemForm, VerifyAskOthers, VerifyInline, WrenchSetupCard } from './lazy-parts';
import { PassRing } from './pass-ring';
import { PassSetting } from './pass-setting';
import { confirmWord, passName } from './pass-words';
import { SpecWordsBox, type SpecWords } from './spec-words';
import { cue } from './use-confirm-bolt';
import { useRingTaps } from './use-ring-taps';
import type { TypedSetting } from './wrench-setup-card';

const big = 'min-h-16 w-full rounded-xl px-4 text-lg font-bold';

/**
 * One pass at a time. A full-width card says which wrench to set to what, and must be
 * acknowledged before the first bolt; then the ring, the setting in a line that stays in view,
 * and one big button for the highlighted bolt (two on a check pass: it turned, or it did not).
 * Memoised: it redraws on a tap (new progress), not on a save's answer.
 */
export const TorquePanel = memo(function TorquePanel({
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
  const speak = useRunnerSettings((s) => s.speak);
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
  const index = state.currentPass;
  const pass = index ? (state.passes[index - 1] ?? null) : null;
  // A check pass added because a bolt turned is at the final target, like the plan's last pass.
  const target = index ? (targets[index - 1] ?? targets.at(-1) ?? null) : null;
  const allVerifications = useMemo(() => [...fresh, ...verifications], [fresh, verifications]);
  // The engine's wrench choice and the verification check (shop-day recency) depend on the pass,
  // not on each bolt: worked out again when the pass, the wrenches or the verifications change,
  // and at most a minute late for the clock (recency is counted in the shop's days).
  const minute = Math.floor(Date.now() / 60_000);
  const chosenId = pass?.wrenchId;
  const gate = useMemo(
    () =>
      target
        ? passWrench({
            target,
            wrenches,
            failed,
            chosenId,
            rules,
            verifications: allVerifications,
            now: new Date(),
          })
        : null,
    // eslint-disable-next-line react-hooks/exhaustive-deps -- `minute` stands for `new Date()`
    [target, wrenches, failed, chosenId, rules, allVerifications, minute],
  );
  const { best = null, suitable = [], wrench = null, choice = null } = gate ?? {};
  // Practice records no verification (nothing touches the tool crib): its gate is not asked.
  const verification = practice ? null : (gate?.verification ?? null);

  const mine = setup && pass ? (typed[pass.index] ?? null) : null;
  const used = setup
    ? mine && { wrench: wrenches.find((w) => w.id === mine.wrenchId)!, setting: mine.setting }
    : wrench && choice?.ok
      ? { wrench, setting: choice.setting }
      : null;
  const clearSelected = useCallback(() => setSelected(null), []);
  const { confirm, undo } = useRingTaps(record, clearSelected, { pass: pass?.index ?? 0, used });
  const openProblem = useCallback(() => setProblem(true), []);
  // The last bolt confirmed: in this pass, or the pass before when this one has none yet.
  const previous = pass ? state.passes[pass.index - 2] : undefined;
  const lastOf = pass?.confirmed.length ? pass : previous?.confirmed.length ? previous : null;
  const lastPass = lastOf?.index ?? 0;
  const lastBolt = lastOf?.confirmed.at(-1) ?? 0;
  const last = useMemo(
    () => (lastBolt ? { pass: lastPass, bolt: lastBolt } : null),
    [lastPass, lastBolt],
  );

  // Spoken once the new bolt is on screen: starting speech in the tap's frame delays the drawing.
  useEffect(() => {
    if (!pass?.next || !speak || memory) return;
    let current = true;
    void afterPaint().then(() => current && cue(`Bolt ${pass.next}`, speak, false));
    return () => {
      current = false;
    };
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
  const settingText = used ? `${used.setting.value} ${UNIT_LABELS[used.setting.unit]}` : null;
  const ackKey =
    wrench && choice?.ok
      ? `${pass.index}|${wrench.id}|${choice.setting.value}|${choice.setting.unit}`
      : null;
  const word = confirmWord(used?.wrench.kind);

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
      <PassSetting
        title={`${name}: ${formatTorque(target, 2)}`}
        passIndex={pass.index}
        wrench={wrench}
        setting={settingText}
        warnings={choice.warnings}
        suitable={suitable}
        best={best}
        specWords={specWords}
        cautions={cautions}
        onPick={(wrenchId) =>
          void record({ type: 'wrench_chosen', payload: { pass: pass.index, wrenchId } })
        }
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
      />
    );
  }

  return (
    <PassRing
      pass={pass}
      name={name}
      boltCount={boltCount}
      cautions={cautions}
      flaggedBolts={flaggedBolts}
      memory={memory}
      word={word}
      settingLine={`Set ${used.wrench.label} to ${settingText}`}
      selected={selected}
      onSelect={setSelected}
      confirm={confirm}
      undo={undo}
      last={last}
      onProblem={openProblem}
    />
  );
});
