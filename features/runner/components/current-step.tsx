'use client';

import { memo, useMemo, type ReactNode } from 'react';
import { arrowDirection } from '@/features/torque-plan';
import type { RunEvent } from '../events';
import { missingPhotos } from '../photo-kinds';
import type { RunnerState } from '../state';
import type { Step } from '../steps';
import type { PhotoSlotFor } from './bolt-problem';
import { HandStartPanel } from './hand-start-panel';
import { PhotoCapture, ReinstallPanel, SummaryPanel } from './lazy-parts';
import type { Photo } from './photo-capture';
import type { RunnerProps } from './runner-props';
import { StepPanel } from './step-panel';
import { TorquePanel } from './torque-panel';

/**
 * The screen of the step the wheel is at. Hand-start and the torque passes (the bolt circle and
 * the big button) and the checklist steps come with the page; the photos, re-install and the
 * summary load when their step opens. Memoised: the runner hands it stable props, so only a
 * change of progress (a tap) redraws it, not a save's answer.
 */
export const CurrentStep = memo(function CurrentStep({
  run,
  step,
  state,
  record,
  waiting,
  unfinished,
  photos,
  onPhotoAdded,
  boltPhoto,
  flaggedBolts,
}: {
  run: RunnerProps;
  step: Step;
  state: RunnerState;
  record: (e: RunEvent) => Promise<void>;
  /** Events this phone still holds: Submit waits for them. */
  waiting: number;
  /** Titles of the steps not done yet (practice's Finish lists them). */
  unfinished: string[];
  photos: Photo[];
  onPhotoAdded: (p: Photo) => void;
  boltPhoto: PhotoSlotFor;
  flaggedBolts: readonly number[];
}) {
  const { plan, wheel, practice } = run;
  // One object for as long as the level holds, so the torque panel's memo holds between taps.
  const level = practice?.level;
  const passPractice = useMemo(() => (level ? { level } : undefined), [level]);
  const photoKinds = photos.map((p) => p.kind);
  if (step.id === 'hand_start')
    return (
      <HandStartPanel
        boltCount={plan.boltCount}
        started={state.handStarted}
        next={state.nextHandStart}
        cautions={step.cautions}
        record={record}
        specWords={run.spec.words}
        flaggedBolts={flaggedBolts}
        photoSlot={practice ? undefined : boltPhoto}
      />
    );
  if (step.id === 'torque')
    return (
      <TorquePanel
        state={state}
        targets={run.targets}
        wrenches={run.wrenches}
        verifications={run.verifications}
        rules={run.rules}
        mayRecordVerifications={run.mayRecordVerifications === true}
        cautions={step.cautions}
        boltCount={plan.boltCount}
        record={record}
        specWords={run.spec.words}
        flaggedBolts={flaggedBolts}
        photoSlot={practice ? undefined : boltPhoto}
        practice={passPractice}
      />
    );
  if (step.id === 'submit' && practice)
    return practice.finish({ waiting, unfinished, early: false });
  if (step.id === 'submit')
    return (
      <SummaryPanel
        wheelId={wheel.id}
        plan={plan}
        state={state}
        targets={run.targets}
        wrenches={run.wrenches}
        minFractionOfMax={run.rules.minFractionOfMax}
        photoKinds={photoKinds}
        waiting={waiting}
      />
    );
  if (step.id === 'reinstall')
    return (
      <ReinstallPanel
        step={step}
        record={record}
        lug={run.spec.lug ?? { torque: null, count: null }}
        wrenches={run.wrenches}
        verifications={run.verifications}
        rules={run.rules}
      />
    );
  return (
    <StepPanel
      key={step.id}
      step={step}
      record={record}
      limit={
        step.id === 'seat_bead'
          ? { value: run.spec.maxBeadSeatPressure, unit: run.spec.pressureUnit }
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
      extra={stepExtra(run, step, photos, onPhotoAdded)}
    />
  );
});

/** What a checklist step shows above its list: the arrow's direction, the target, the photos. */
function stepExtra(
  { wheel, practice }: RunnerProps,
  step: Step,
  photos: Photo[],
  onPhotoAdded: (p: Photo) => void,
): ReactNode {
  if (step.id === 'mount' && wheel.directional)
    return (
      <p className="border-work bg-work-tint text-work-dark rounded-xl border-2 p-3 text-lg font-bold">
        {arrowDirection(wheel.position).instruction}
      </p>
    );
  if (step.id === 'leak_check')
    return (
      <p className="text-lg">
        Target pressure:{' '}
        <strong>
          {wheel.targetPressure} {wheel.pressureUnit}
        </strong>
      </p>
    );
  if (step.id === 'seat_bead' && practice)
    return (
      <p className="border-ink-soft rounded-xl border-2 border-dashed p-3">
        Photos are optional in practice. On a real wheel you take both bead photos here, and the
        wheel cannot be submitted without them.
      </p>
    );
  if (step.id === 'seat_bead')
    return <PhotoCapture wheelId={wheel.id} photos={photos} onAdded={onPhotoAdded} />;
  return null;
}
