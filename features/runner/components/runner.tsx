'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import {
  arrowDirection,
  type PressureUnit,
  type RecordedVerification,
  type Torque,
  type WheelPosition,
} from '@/features/torque-plan';
import { useRunQueue, type SaveEvents } from '../api/use-run-queue';
import type { BackLink } from '../back-link';
import type { ClientEvent } from '../events';
import type { RunnerPractice } from '../practice-mode';
import { missingPhotos } from '../photo-kinds';
import { useRunnerSettings } from '../settings-store';
import { reduceRun, type RunnerPlan } from '../state';
import type { CribWrench, WrenchRules } from '../wrench-gate';
import { HandStartPanel } from './hand-start-panel';
import { KeepRunnerOffline } from './keep-runner-offline';
import { PhotoCapture, PhotoSlot, type Photo } from './photo-capture';
import { NeedsAttention } from './needs-attention';
import { ReinstallPanel } from './reinstall-panel';
import { ReworkNote } from './rework-note';
import { BoltCircle } from '@/features/bolt-circle/bolt-circle';
import type { SpecWords } from './spec-words';
import { StepPanel } from './step-panel';
import { SummaryPanel } from './summary-panel';
import { TorquePanel } from './torque-panel';
import { useWakeLock } from './use-wake-lock';

export type RunnerProps = {
  jobId: string;
  jobNumber: number;
  wheel: {
    id: string;
    position: WheelPosition;
    tireSize: string;
    directional: boolean;
    targetPressure: number;
    pressureUnit: PressureUnit;
  };
  spec: {
    name: string;
    maxBeadSeatPressure: number;
    pressureUnit: PressureUnit;
    lugTorque: string | null;
    /** The lug torque and lug count for re-install (the snapshot's), when the spec has them. */
    lug?: { torque: Torque | null; count: number | null };
    /** The spec's own words, shown at hand-start and with the first pass. */
    words?: SpecWords;
  };
  plan: RunnerPlan;
  targets: Torque[];
  wrenches: CribWrench[];
  /** Recent passing verifications; the shop's policy (in `rules`) decides per pass which count. */
  verifications: RecordedVerification[];
  /** The shop's wrench floor and verification policy. */
  rules: WrenchRules;
  events: ClientEvent[];
  photos: Photo[];
  /** The server action that stores confirmed events; the page hands it down. */
  saveEvents: SaveEvents;
  /** Sign-in that comes back to this runner, for when the session ends mid-wheel. */
  signInHref: string;
  /** A lead sent this wheel back: their note, and the steps to redo (none = the whole wheel). */
  rework?: { note: string; steps: string[]; at: string } | null;
  /** Who is signed in: the phone keeps each person's outbox apart and never sends one under another's name. */
  person: { id: string; name: string };
  /** The header's "←" (runnerBackLink): the job card, or My wheels for someone who may not open it. */
  back?: BackLink;
  /** Whether this person may record a wrench verification on the spot (verifications.record). */
  mayRecordVerifications?: boolean;
  /** Practice mode: a simulated wheel; photos optional, Finish instead of Submit (see RunnerPractice). */
  practice?: RunnerPractice;
};

/** The guided procedure for one wheel on a phone at the tire cart. */
export function Runner(props: RunnerProps) {
  const { plan, wheel } = props;
  const person = useMemo(
    () => ({ id: props.person.id, name: props.person.name }),
    [props.person.id, props.person.name],
  );
  const { events, record, status, attention, others, dismiss } = useRunQueue(
    wheel.id,
    props.events,
    props.saveEvents,
    person,
    props.rework?.at ?? null,
    props.practice?.eventsUrl,
  );
  const state = useMemo(() => reduceRun(plan, events), [plan, events]);
  const [photos, setPhotos] = useState<Photo[]>(props.photos);
  const photoKinds = photos.map((p) => p.kind);
  const settings = useRunnerSettings();
  const wake = useWakeLock();
  const step = plan.steps.find((s) => s.id === state.current) ?? plan.steps.at(-1)!;
  const stepNo = plan.steps.indexOf(step) + 1;
  // A photo of a damaged bolt goes up as an 'other' photo of the wheel; the flag carries its id.
  const { practice } = props;
  const back = practice?.back ??
    props.back ?? { href: `/jobs/${props.jobId}`, label: `Job #${props.jobNumber}` };
  const unfinished = plan.steps
    .filter((s) => s.id !== 'submit' && state.status[s.id] === 'todo')
    .map((s) => s.title);
  const boltPhoto = (onAdded: (photoId: string) => void) => (
    <PhotoSlot
      wheelId={wheel.id}
      kind="other"
      photos={[]}
      onAdded={(p) => {
        setPhotos((all) => [...all, p]);
        onAdded(p.id);
      }}
    />
  );
  const flaggedBolts = useMemo(() => state.flaggedBolts.map((f) => f.bolt), [state.flaggedBolts]);

  return (
    <div className="mx-auto flex min-h-dvh max-w-xl flex-col">
      <KeepRunnerOffline />
      <header className="bg-ink sticky top-0 z-10 px-3 py-2 text-white landscape:py-1">
        <div className="flex items-center justify-between gap-2">
          {/* On its side the phone has little height: one line, so the ring keeps the room. */}
          <div className="flex min-w-0 flex-col landscape:flex-row landscape:items-center landscape:gap-3">
            <Link
              href={back.href}
              className="min-h-touch inline-flex shrink-0 items-center font-bold underline"
            >
              ← {back.label}
            </Link>
            <p className="font-semibold">
              {wheel.position} · {wheel.tireSize} · {props.spec.name}
            </p>
          </div>
          <p
            role="status"
            aria-live="polite"
            className={`shrink-0 rounded-full px-3 py-1 text-sm font-bold ${!status.ready ? 'text-ink bg-white' : status.waiting ? 'bg-caution text-caution-ink' : 'bg-ok text-white'}`}
          >
            {!status.ready
              ? 'Checking this phone…'
              : status.waiting
                ? `${status.waiting} waiting${status.online ? '' : ' · offline'}`
                : 'Saved'}
          </p>
        </div>
        {status.error ? (
          <p role="alert" className="bg-danger mt-1 rounded px-2 py-1 text-sm font-bold">
            {status.error}
            {status.signedOut ? (
              <>
                {' '}
                <a
                  href={props.signInHref}
                  className="min-h-touch inline-flex items-center underline"
                >
                  Sign in again
                </a>
              </>
            ) : null}
          </p>
        ) : null}
      </header>
      <main className="flex flex-1 flex-col gap-4 p-3">
        {practice ? (
          <div className="border-work bg-work-tint text-work-dark flex flex-wrap items-center justify-between gap-2 rounded-xl border-2 px-3 py-2">
            <p className="font-black">Practice — nothing here touches a real wheel.</p>
            {practice.finish({ waiting: status.waiting, unfinished, early: true })}
          </div>
        ) : null}
        <NeedsAttention items={attention} others={others} onDismiss={() => void dismiss()} />
        {props.rework ? (
          <ReworkNote
            note={props.rework.note}
            steps={props.rework.steps.map((id) => plan.steps.find((s) => s.id === id)?.title ?? id)}
          />
        ) : null}
        {state.flagged ? (
          <div
            role="alert"
            className="border-danger bg-danger-tint text-danger rounded-xl border-4 p-4"
          >
            <p className="text-xl font-black">
              {flaggedBolts.length
                ? 'Wheel stopped: problem with a bolt'
                : 'Wheel stopped: inspection failed'}
            </p>
            <p>{state.flagged}</p>
            <p className="mt-2 font-semibold">
              Leave the wheel as it is: it is flagged for a lead, and nothing goes back on the
              vehicle until a lead has looked at it and the parts are right.
            </p>
            {practice ? (
              <div className="mt-3">
                {practice.finish({ waiting: status.waiting, unfinished, early: false })}
              </div>
            ) : null}
            {flaggedBolts.length ? (
              <div className="mt-3 bg-white">
                <BoltCircle
                  count={plan.boltCount}
                  done={[]}
                  mode="preview"
                  flagged={flaggedBolts}
                  label={`Bolt circle: bolt ${flaggedBolts.join(', ')} flagged`}
                />
              </div>
            ) : null}
          </div>
        ) : (
          <>
            <h1 className="text-xl font-black sm:text-2xl">
              <span className="text-ink-soft">
                Step {stepNo} of {plan.steps.length} ·{' '}
              </span>
              {step.title}
            </h1>
            {step.id === 'hand_start' ? (
              <HandStartPanel
                boltCount={plan.boltCount}
                started={state.handStarted}
                next={state.nextHandStart}
                cautions={step.cautions}
                record={record}
                specWords={props.spec.words}
                flaggedBolts={flaggedBolts}
                photoSlot={practice ? undefined : boltPhoto}
              />
            ) : step.id === 'torque' ? (
              <TorquePanel
                state={state}
                targets={props.targets}
                wrenches={props.wrenches}
                verifications={props.verifications}
                rules={props.rules}
                mayRecordVerifications={props.mayRecordVerifications === true}
                cautions={step.cautions}
                boltCount={plan.boltCount}
                record={record}
                specWords={props.spec.words}
                flaggedBolts={flaggedBolts}
                photoSlot={practice ? undefined : boltPhoto}
                practice={practice ? { level: practice.level } : undefined}
              />
            ) : step.id === 'submit' && practice ? (
              practice.finish({ waiting: status.waiting, unfinished, early: false })
            ) : step.id === 'submit' ? (
              <SummaryPanel
                wheelId={wheel.id}
                plan={plan}
                state={state}
                targets={props.targets}
                wrenches={props.wrenches}
                minFractionOfMax={props.rules.minFractionOfMax}
                photoKinds={photoKinds}
                waiting={status.waiting}
              />
            ) : step.id === 'reinstall' ? (
              <ReinstallPanel
                step={step}
                record={record}
                lug={props.spec.lug ?? { torque: null, count: null }}
                wrenches={props.wrenches}
                verifications={props.verifications}
                rules={props.rules}
              />
            ) : (
              <StepPanel
                key={step.id}
                step={step}
                record={record}
                limit={
                  step.id === 'seat_bead'
                    ? { value: props.spec.maxBeadSeatPressure, unit: props.spec.pressureUnit }
                    : undefined
                }
                readingUnit={wheel.pressureUnit}
                target={
                  step.id === 'leak_check'
                    ? { value: wheel.targetPressure, unit: wheel.pressureUnit }
                    : undefined
                }
                blocked={
                  step.id === 'seat_bead' && !practice && missingPhotos(photoKinds).length
                    ? 'Add both bead photos first.'
                    : undefined
                }
                extra={
                  step.id === 'mount' && wheel.directional ? (
                    <p className="border-work bg-work-tint text-work-dark rounded-xl border-2 p-3 text-lg font-bold">
                      {arrowDirection(wheel.position).instruction}
                    </p>
                  ) : step.id === 'leak_check' ? (
                    <p className="text-lg">
                      Target pressure:{' '}
                      <strong>
                        {wheel.targetPressure} {wheel.pressureUnit}
                      </strong>
                    </p>
                  ) : step.id === 'seat_bead' && practice ? (
                    <p className="border-ink-soft rounded-xl border-2 border-dashed p-3">
                      Photos are optional in practice. On a real wheel you take both bead photos
                      here, and the wheel cannot be submitted without them.
                    </p>
                  ) : step.id === 'seat_bead' ? (
                    <PhotoCapture
                      wheelId={wheel.id}
                      photos={photos}
                      onAdded={(p) => setPhotos((all) => [...all, p])}
                    />
                  ) : null
                }
              />
            )}
          </>
        )}
      </main>
      <footer className="border-paper-line flex flex-wrap items-center gap-3 border-t-2 p-3 text-sm">
        <label className="min-h-touch flex items-center gap-2">
          <input
            type="checkbox"
            className="size-6"
            checked={settings.speak}
            onChange={settings.toggleSpeak}
          />{' '}
          Speak the next bolt
        </label>
        <label className="min-h-touch flex items-center gap-2">
          <input
            type="checkbox"
            className="size-6"
            checked={settings.vibrate}
            onChange={settings.toggleVibrate}
          />{' '}
          Vibrate on each bolt
        </label>
        <span>
          {wake === 'on'
            ? 'Screen stays on.'
            : wake === 'unsupported'
              ? 'This browser cannot keep the screen on: set the screen timeout longer.'
              : ''}
        </span>
      </footer>
    </div>
  );
}
