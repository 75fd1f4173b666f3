'use client';

import { useCallback, useMemo, useState } from 'react';
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
  // Everything handed down below is stable between taps (useCallback/useMemo, primitives), so a
  // tap redraws the step on screen and the header's count, and a save's answer the header alone.
  const addPhoto = useCallback((p: Photo) => setPhotos((all) => [...all, p]), []);
  const step = plan.steps.find((s) => s.id === state.current) ?? plan.steps.at(-1)!;
  const stepNo = plan.steps.indexOf(step) + 1;
  const back = useMemo(
    () =>
      practice?.back ??
      props.back ?? { href: `/jobs/${props.jobId}`, label: `Job #${props.jobNumber}` },
    [practice?.back, props.back, props.jobId, props.jobNumber],
  );
  const unfinished = useSameList(
    plan.steps
      .filter((s) => s.id !== 'submit' && state.status[s.id] === 'todo')
      .map((s) => s.title),
  );
  // A photo of a damaged bolt goes up as an 'other' photo of the wheel; the flag carries its id.
  const boltPhoto = useCallback(
    (onAdded: (photoId: string) => void) => (
      <PhotoSlot
        wheelId={wheel.id}
        kind="other"
        photos={[]}
        onAdded={(p) => {
          addPhoto(p);
          onAdded(p.id);
        }}
      />
    ),
    [wheel.id, addPhoto],
  );
  const flaggedBolts = useSameList(state.flaggedBolts.map((f) => f.bolt));
  const onDismiss = useCallback(() => void dismiss(), [dismiss]);
  // Only the submit step (and practice's Finish) shows what still waits: elsewhere a save's answer
  // changes nothing below the header.
  const waiting = step.id === 'submit' || practice ? status.waiting : 0;

  return (
    <div className="mx-auto flex min-h-dvh max-w-xl flex-col">
      <KeepRunnerOffline />
      <RunnerHeader
        back={back}
        title={`${wheel.position} · ${wheel.tireSize} · ${props.spec.name}`}
        waiting={status.waiting}
        ready={status.ready}
        online={status.online}
        error={status.error}
        signedOut={status.signedOut}
        signInHref={props.signInHref}
      />
      <main className="flex flex-1 flex-col gap-4 p-3">
        {practice ? (
          <div className="border-work bg-work-tint text-work-dark flex flex-wrap items-center justify-between gap-2 rounded-xl border-2 px-3 py-2">
            <p className="font-black">Practice — nothing here touches a real wheel.</p>
            {practice.finish({ waiting, unfinished, early: true })}
          </div>
        ) : null}
        <NeedsAttention items={attention} others={others} onDismiss={onDismiss} />
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
            finish={practice ? practice.finish({ waiting, unfinished, early: false }) : undefined}
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
              waiting={waiting}
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

/** The same array as last render while its items are the same, so a memoised child keeps its memo. */
function useSameList<T extends string | number>(items: T[]): T[] {
  const key = items.join('\u0000');
  // eslint-disable-next-line react-hooks/exhaustive-deps -- the key stands for the items
  return useMemo(() => items, [key]);
}
