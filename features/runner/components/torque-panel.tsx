'use client';

import { useEffect, useMemo, useState } from 'react';
import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import { formatTorque, UNIT_LABELS, type RecordedVerification, type Torque } from '@/features/torque-plan';
import type { RunEvent } from '../events';
import type { RunnerState } from '../state';
import { useRunnerSettings } from '../settings-store';
import { passWrench, type CribWrench, type WrenchRules } from '../wrench-gate';
import { Caution } from './caution';
import { RingLayout, ringButtonClass } from './ring-layout';
import { VerifyInline } from './verify-inline';

const big = 'min-h-16 w-full rounded-xl px-4 text-lg font-bold';

function cue(text: string, speak: boolean, vibrate: boolean) {
  if (vibrate && 'vibrate' in navigator) navigator.vibrate(40);
  if (speak && 'speechSynthesis' in window) {
    window.speechSynthesis.cancel();
    window.speechSynthesis.speak(new SpeechSynthesisUtterance(text));
  }
}

/**
 * One pass at a time: the target, the wrench and its setting in the wrench's own units, the
 * bolt circle, and one big "clicked" button that confirms the highlighted bolt.
 */
export function TorquePanel({
  state,
  targets,
  wrenches,
  verifications,
  rules,
  cautions,
  boltCount,
  record,
}: {
  state: RunnerState;
  targets: Torque[];
  wrenches: CribWrench[];
  verifications: RecordedVerification[];
  rules: WrenchRules;
  cautions: string[];
  boltCount: number;
  record: (e: RunEvent) => Promise<void>;
}) {
  const { speak, vibrate } = useRunnerSettings();
  // Verifications recorded on this phone since the page loaded, judged like the server's.
  const [fresh, setFresh] = useState<RecordedVerification[]>([]);
  const [failed, setFailed] = useState<string[]>([]);
  const [selected, setSelected] = useState<number | null>(null);
  const index = state.currentPass;
  const pass = index ? state.passes[index - 1]! : null;
  const target = index ? targets[index - 1]! : null;
  const allVerifications = useMemo(() => [...fresh, ...verifications], [fresh, verifications]);
  const gate = target
    ? passWrench({ target, wrenches, failed, chosenId: pass?.wrenchId, rules, verifications: allVerifications, now: new Date() })
    : null;
  const { best = null, suitable = [], wrench = null, choice = null, verification = null } = gate ?? {};
  const wrenchId = wrench?.id ?? null;

  useEffect(() => {
    if (pass?.next && speak) cue(`Bolt ${pass.next}`, speak, false);
  }, [pass?.next, speak]);

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

  const label = pass.kind === 'check' ? 'check pass' : `pass ${pass.index}`;
  const confirm = (bolt: number) => {
    // What was used, as shown at this moment: the wrench and its setting travel with the bolt.
    const used = wrench && choice?.ok ? { wrenchId: wrench.id, setting: choice.setting } : {};
    void record({ type: 'bolt_confirmed', payload: { pass: pass.index, bolt, ...used } });
    cue(`Bolt ${bolt} done`, false, vibrate);
    setSelected(null);
  };

  return (
    <div className="flex flex-col gap-4">
      <Caution items={cautions} />
      <section aria-label="This pass" className="border-ink rounded-xl border-2 p-3">
        <p className="text-lg font-bold">
          {pass.kind === 'check'
            ? 'Check pass'
            : `Pass ${pass.index} of ${state.passes.filter((p) => p.kind === 'staged').length}`}
          : {formatTorque(target, 2)}
        </p>
        {choice?.ok ? (
          <p className="text-2xl font-black">
            Set {wrench!.label} to {choice.setting.value} {UNIT_LABELS[choice.setting.unit]}
          </p>
        ) : (
          <p role="alert" className="text-danger font-bold">
            {best && !best.ok ? best.reason : 'No in-service wrench suits this pass.'}
          </p>
        )}
        {choice?.ok
          ? choice.warnings.map((w) => (
              <p key={w} className="text-caution-ink mt-1 font-semibold">
                ⚠ {w}
              </p>
            ))
          : null}
        {suitable.length > 1 ? (
          <label className="mt-2 flex flex-col gap-1 font-semibold">
            Wrench
            <select
              value={wrenchId ?? ''}
              onChange={(e) =>
                void record({
                  type: 'wrench_chosen',
                  payload: { pass: pass.index, wrenchId: e.target.value },
                })
              }
              className="border-ink-soft min-h-14 rounded-xl border-2 px-2 text-lg"
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
      </section>
      {wrench && choice?.ok && verification && !verification.counts ? (
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
      ) : wrench && choice?.ok ? (
        <RingLayout
          ring={
            <BoltCircle
              count={boltCount}
              order={pass.order}
              done={pass.confirmed}
              next={pass.next}
              passLabel={label}
              selected={selected}
              onSelect={setSelected}
              label={`Bolt circle, ${label}: ${pass.confirmed.length} of ${boltCount} done`}
            />
          }
        >
          <p aria-live="polite" className="text-center text-lg">
            {pass.confirmed.length} of {boltCount} bolts · next: bolt {pass.next}
          </p>
          <p className="text-ink-soft text-center text-sm">
            Number inside a bolt: its turn in this pass. Number outside: the bolt. Tap a bolt to
            undo or correct it.
          </p>
          {selected && selected !== pass.next ? (
            pass.confirmed.includes(selected) ? (
              <button
                type="button"
                onClick={() => {
                  void record({
                    type: 'bolt_undone',
                    payload: { pass: pass.index, bolt: selected },
                  });
                  setSelected(null);
                }}
                className={`${big} border-ink border-2`}
              >
                Undo bolt {selected}
              </button>
            ) : (
              <button
                type="button"
                onClick={() => confirm(selected)}
                className={`${big} border-caution bg-caution-tint text-caution-ink border-4`}
              >
                Bolt {selected} is out of sequence: confirm it anyway
              </button>
            )
          ) : null}
          <button
            type="button"
            onClick={() => pass.next && confirm(pass.next)}
            className={ringButtonClass}
          >
            Clicked — bolt {pass.next}
          </button>
        </RingLayout>
      ) : null}
    </div>
  );
}
