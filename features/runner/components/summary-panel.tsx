'use client';

import { useState } from 'react';
import {
  chooseWrench,
  formatTorque,
  UNIT_LABELS,
  type Torque,
  type Wrench,
} from '@/features/torque-plan';
import { useShopTime } from '@/features/ui/shop-time-zone';
import { formatDuration } from '../duration';
import { PHOTO_KIND_INFO, REQUIRED_PHOTOS } from '../photo-kinds';
import { submitBlockers, type RunnerPlan, type RunnerState } from '../state';

/** The wheel at a glance before it is submitted: passes, wrench and setting, anomalies, time per step. */
export function SummaryPanel({
  wheelId,
  plan,
  state,
  targets,
  wrenches,
  minFractionOfMax,
  photoKinds,
  waiting = 0,
}: {
  wheelId: string;
  plan: RunnerPlan;
  state: RunnerState;
  targets: Torque[];
  wrenches: (Wrench & { label: string })[];
  minFractionOfMax: number;
  photoKinds: string[];
  waiting?: number;
}) {
  const [result, setResult] = useState<{ ok: boolean; text: string } | null>(null);
  const clock = useShopTime();
  // The server judges the wheel on what it has stored: submit only once this phone has sent everything.
  const blockers = [
    ...submitBlockers(plan, state, photoKinds),
    ...(waiting
      ? [
          `${waiting} confirmation${waiting === 1 ? '' : 's'} still waiting on this phone to be saved.`,
        ]
      : []),
  ];
  const times = plan.steps
    .filter((s) => state.doneAt[s.id])
    .map((s, i, done) => {
      const prev = i > 0 ? state.doneAt[done[i - 1]!.id] : undefined;
      const took = prev ? formatDuration(Date.parse(state.doneAt[s.id]!) - Date.parse(prev)) : null;
      return { title: s.title, status: state.status[s.id], at: state.doneAt[s.id]!, took };
    });

  async function submit() {
    const res = await fetch(`/api/wheels/${wheelId}/submit`, { method: 'POST' }).catch(() => null);
    const body = (await res?.json().catch(() => null)) as {
      data?: { allSubmitted: boolean };
      error?: { message: string };
    } | null;
    if (res?.ok && body?.data)
      setResult({
        ok: true,
        text: body.data.allSubmitted
          ? 'Wheel submitted. Every wheel is in: the job card went to sign-off.'
          : 'Wheel submitted.',
      });
    else
      setResult({
        ok: false,
        text:
          body?.error?.message ?? 'Not submitted: no connection. Try again when the Wi-Fi is back.',
      });
  }

  return (
    <div className="flex flex-col gap-4">
      <section aria-labelledby="passes-h">
        <h3 id="passes-h" className="text-lg font-bold">
          Passes
        </h3>
        <ul className="flex flex-col gap-1">
          {state.passes.map((p, i) => {
            const w = wrenches.find((x) => x.id === p.wrenchId) ?? null;
            const choice = chooseWrench(targets[i]!, w ? [w] : wrenches, { minFractionOfMax });
            const label = choice.ok
              ? `${wrenches.find((x) => x.id === choice.wrenchId)?.label} at ${choice.setting.value} ${UNIT_LABELS[choice.setting.unit]}`
              : 'no wrench';
            return (
              <li key={p.index}>
                {p.kind === 'check' ? 'Check pass' : `Pass ${p.index}`}:{' '}
                {formatTorque(targets[i]!, 2)} — {label} — {p.confirmed.length}/{plan.boltCount}{' '}
                bolts {p.complete ? '✓' : ''}
              </li>
            );
          })}
        </ul>
      </section>
      <section aria-labelledby="anomalies-h">
        <h3 id="anomalies-h" className="text-lg font-bold">
          Anomalies ({state.anomalies.length})
        </h3>
        {state.anomalies.length ? (
          <ul>
            {state.anomalies.map((a) => (
              <li key={`${a.pass}-${a.bolt}-${a.at}`}>
                Pass {a.pass}: bolt {a.bolt} confirmed out of sequence
                {a.expected ? ` (expected bolt ${a.expected})` : ''}
              </li>
            ))}
          </ul>
        ) : (
          <p>None: every bolt in sequence.</p>
        )}
      </section>
      <p>
        Photos:{' '}
        {REQUIRED_PHOTOS.map(
          (kind) => `${PHOTO_KIND_INFO[kind].short} ${photoKinds.includes(kind) ? '✓' : 'missing'}`,
        ).join(' · ')}
        {photoKinds.filter((k) => k === 'other').length
          ? ` · ${photoKinds.filter((k) => k === 'other').length} other`
          : ''}
      </p>
      <section aria-labelledby="times-h">
        <h3 id="times-h" className="text-lg font-bold">
          Steps
        </h3>
        <ul>
          {times.map((t) => (
            <li key={t.title}>
              {t.title}:{' '}
              {t.status === 'skipped'
                ? `skipped (${state.skipReasons[plan.steps.find((s) => s.title === t.title)!.id]})`
                : 'done'}{' '}
              at {clock.format(t.at, 'time')}
              {t.took !== null ? ` · ${t.took}` : ''}
            </li>
          ))}
        </ul>
      </section>
      {blockers.length ? (
        <div
          role="alert"
          className="border-danger bg-danger-tint text-danger rounded-xl border-2 p-3"
        >
          <p className="font-bold">Not ready to submit:</p>
          <ul className="ml-5 list-disc">
            {blockers.map((b) => (
              <li key={b}>{b}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {result ? (
        <p
          role={result.ok ? 'status' : 'alert'}
          className={`rounded-xl border-2 p-3 font-bold ${result.ok ? 'border-ok text-ok' : 'border-danger text-danger'}`}
        >
          {result.text}
        </p>
      ) : null}
      <button
        type="button"
        disabled={blockers.length > 0}
        onClick={() => void submit()}
        className="bg-work disabled:bg-paper-line disabled:text-ink-soft min-h-16 w-full rounded-xl px-4 text-lg font-bold text-white"
      >
        Submit the wheel
      </button>
    </div>
  );
}
