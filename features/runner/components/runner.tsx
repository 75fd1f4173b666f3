'use client';

import { useMemo, useState } from 'react';
import { useRunQueue } from '../api/use-run-queue';
import { useRunState } from './use-run-state';
import { CurrentStep } from './current-step';
import { KeepRunnerOffline } from './keep-runner-offline';
import { PhotoSlot } from './lazy-parts';
import { NeedsAttention } from './needs-attention';
import type { Photo } from './photo-capture';
import { ReworkNote } from './rework-note';
import { RunnerFooter } from './runner-footer';
import { RunnerHeader } from './runner-header';
import type { RunnerProps } from './runner-props';
import { WheelStopped } from './wheel-stopped';

export type { RunnerProps } from './runner-props';

/** The guided procedure for one wheel on a phone at the tire cart. */
export function Runner(props: RunnerProps) {
  const { plan, wheel, practice } = props;
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
    practice?.eventsUrl,
  );
  const state = useRunState(plan, events);
  const [photos, setPhotos] = useState<Photo[]>(props.photos);
  const addPhoto = (p: Photo) => setPhotos((all) => [...all, p]);
  const step = plan.steps.find((s) => s.id === state.current) ?? plan.steps.at(-1)!;
  const stepNo = plan.steps.indexOf(step) + 1;
  const back = practice?.back ??
    props.back ?? { href: `/jobs/${props.jobId}`, label: `Job #${props.jobNumber}` };
  const unfinished = plan.steps
    .filter((s) => s.id !== 'submit' && state.status[s.id] === 'todo')
    .map((s) => s.title);
  // A photo of a damaged bolt goes up as an 'other' photo of the wheel; the flag carries its id.
  const boltPhoto = (onAdded: (photoId: string) => void) => (
    <PhotoSlot
      wheelId={wheel.id}
      kind="other"
      photos={[]}
      onAdded={(p) => {
        addPhoto(p);
        onAdded(p.id);
      }}
    />
  );
  const flaggedBolts = useMemo(() => state.flaggedBolts.map((f) => f.bolt), [state.flaggedBolts]);

  return (
    <div className="mx-auto flex min-h-dvh max-w-xl flex-col">
      <KeepRunnerOffline />
      <RunnerHeader
        back={back}
        title={`${wheel.position} · ${wheel.tireSize} · ${props.spec.name}`}
        status={status}
        signInHref={props.signInHref}
      />
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
          <WheelStopped
            reason={state.flagged}
            boltCount={plan.boltCount}
            flaggedBolts={flaggedBolts}
            finish={
              practice
                ? practice.finish({ waiting: status.waiting, unfinished, early: false })
                : undefined
            }
          />
        ) : (
          <>
            <h1 className="text-xl font-black sm:text-2xl">
              <span className="text-ink-soft">
                Step {stepNo} of {plan.steps.length} ·{' '}
              </span>
              {step.title}
            </h1>
            <CurrentStep
              run={props}
              step={step}
              state={state}
              record={record}
              waiting={status.waiting}
              unfinished={unfinished}
              photos={photos}
              onPhotoAdded={addPhoto}
              boltPhoto={boltPhoto}
              flaggedBolts={flaggedBolts}
            />
          </>
        )}
      </main>
      <RunnerFooter />
    </div>
  );
}
