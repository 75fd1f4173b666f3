'use client';

import { useRouter } from 'next/navigation';
import { useRef, useState, useTransition } from 'react';
import { Button } from '@/features/ui/button';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { FormMessage } from '@/features/ui/form-message';
import type { ApproveInput, SendBackInput } from '../schemas';

type Result =
  | { ok: true; message?: string }
  | { ok: false; message: string; fieldErrors?: Record<string, string[] | undefined> };
type Props = {
  jobId: string;
  /** Why this lead may not decide now (not awaiting sign-off, their own work…), or null. */
  refusal: string | null;
  /** The lead worked on the job and the single-lead setting allows them: a written reason is required. */
  selfReview: boolean;
  blocking: { key: string; message: string }[];
  wheels: { id: string; position: string }[];
  steps: { id: string; title: string }[];
  approve: (prev: unknown, input: ApproveInput) => Promise<Result>;
  sendBack: (prev: unknown, input: SendBackInput) => Promise<Result>;
};

/** "LF wheel", "LF and RF wheels", "LF, RF and LR wheels". */
function listed(positions: string[]) {
  if (positions.length === 1) return `${positions[0]} wheel`;
  return `${positions.slice(0, -1).join(', ')} and ${positions.at(-1)} wheels`;
}

const AREA =
  'min-h-20 w-full rounded-lg border-2 bg-paper p-2 text-base text-ink aria-[invalid=true]:border-danger';

/** Approve (each blocking anomaly acknowledged with a reason) or send wheels back with a note each. */
export function DecidePanel({
  jobId,
  refusal,
  selfReview,
  blocking,
  wheels,
  steps,
  approve,
  sendBack,
}: Props) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [result, setResult] = useState<Result | null>(null);
  const [reasons, setReasons] = useState<Record<string, string>>({});
  const [note, setNote] = useState('');
  const [back, setBack] = useState<Record<string, { note: string; steps: string[] } | undefined>>(
    {},
  );
  const sendBackForm = useRef<HTMLFormElement>(null);
  if (refusal) {
    // After a decision the page refreshes into this: the outcome stays on screen above why.
    return (
      <div className="flex flex-col gap-3">
        <FormMessage state={result} pending={pending} />
        <p className="bg-paper-dim rounded-lg p-3">{refusal}</p>
      </div>
    );
  }
  const chosen = wheels.filter((w) => back[w.id]).map((w) => w.position);
  const errors = (name: string) => (result && !result.ok ? result.fieldErrors?.[name] : undefined);
  const run = (call: () => Promise<Result>) =>
    start(async () => {
      const r = await call();
      setResult(r);
      if (r.ok) router.refresh();
    });

  return (
    <div className="flex flex-col gap-6">
      <FormMessage state={result} pending={pending} />
      <form
        aria-label="Sign off"
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          run(() =>
            approve(null, {
              jobId,
              note,
              acknowledgements: Object.entries(reasons).map(([key, reason]) => ({ key, reason })),
            }),
          );
        }}
      >
        <h3 className="text-lg font-bold">Sign off</h3>
        {blocking.map((a, i) => (
          <label key={a.key} className="flex flex-col gap-1">
            <span className="font-semibold">
              Acknowledge {i + 1}: {a.message}
            </span>
            <textarea
              className={AREA}
              name={`ack-${i}`}
              value={reasons[a.key] ?? ''}
              aria-invalid={Boolean(errors(`acknowledgements.${a.key}`))}
              placeholder="Why this is acceptable (kept on the record)"
              onChange={(e) => setReasons((r) => ({ ...r, [a.key]: e.target.value }))}
            />
            {errors(`acknowledgements.${a.key}`) ? (
              <span className="text-danger text-sm font-semibold" role="alert">
                {errors(`acknowledgements.${a.key}`)!.join(' ')}
              </span>
            ) : null}
          </label>
        ))}
        <label className="flex flex-col gap-1">
          <span className="font-semibold">
            {selfReview
              ? 'You worked on this job: why are you signing it off yourself? (required, kept on the record)'
              : 'Note (optional)'}
          </span>
          <textarea
            className={AREA}
            name="note"
            value={note}
            aria-invalid={Boolean(errors('note'))}
            onChange={(e) => setNote(e.target.value)}
          />
          {errors('note') ? (
            <span className="text-danger text-sm font-semibold" role="alert">
              {errors('note')!.join(' ')}
            </span>
          ) : null}
        </label>
        <Button disabled={pending}>Sign off</Button>
      </form>

      <form
        ref={sendBackForm}
        aria-label="Send back"
        className="flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          const chosen = wheels
            .filter((w) => back[w.id])
            .map((w) => ({ wheelId: w.id, note: back[w.id]!.note, steps: back[w.id]!.steps }));
          run(() => sendBack(null, { jobId, wheels: chosen }));
        }}
      >
        <h3 className="text-lg font-bold">Send back</h3>
        <p className="text-ink-soft text-sm">
          Tick the wheels to redo and say what to redo on each; pick steps to redo only those (none
          ticked: the whole wheel).
        </p>
        {wheels.map((w) => {
          const entry = back[w.id];
          // Errors come back by the wheel's place among those ticked.
          const i = wheels.filter((x) => back[x.id]).findIndex((x) => x.id === w.id);
          return (
            <fieldset key={w.id} className="border-paper-line rounded-lg border p-2">
              <legend className="px-1">
                <label className="flex items-center gap-2 font-semibold">
                  <input
                    type="checkbox"
                    className="size-6"
                    checked={Boolean(entry)}
                    onChange={(e) =>
                      setBack((b) => ({
                        ...b,
                        [w.id]: e.target.checked ? { note: '', steps: [] } : undefined,
                      }))
                    }
                  />
                  Send back the {w.position} wheel
                </label>
              </legend>
              {entry ? (
                <div className="flex flex-col gap-2">
                  <label className="flex flex-col gap-1">
                    <span>What to redo on the {w.position} wheel</span>
                    <textarea
                      className={AREA}
                      value={entry.note}
                      aria-invalid={Boolean(errors(`wheels.${i}.note`))}
                      onChange={(e) =>
                        setBack((b) => ({ ...b, [w.id]: { ...entry, note: e.target.value } }))
                      }
                    />
                    {errors(`wheels.${i}.note`) ? (
                      <span className="text-danger text-sm font-semibold" role="alert">
                        {errors(`wheels.${i}.note`)!.join(' ')}
                      </span>
                    ) : null}
                  </label>
                  <div className="flex flex-wrap gap-3 text-sm">
                    {steps.map((s) => (
                      <label key={s.id} className="flex items-center gap-1">
                        <input
                          type="checkbox"
                          checked={entry.steps.includes(s.id)}
                          onChange={(e) =>
                            setBack((b) => ({
                              ...b,
                              [w.id]: {
                                ...entry,
                                steps: e.target.checked
                                  ? [...entry.steps, s.id]
                                  : entry.steps.filter((x) => x !== s.id),
                              },
                            }))
                          }
                        />
                        {s.title}
                      </label>
                    ))}
                  </div>
                </div>
              ) : null}
            </fieldset>
          );
        })}
        <ConfirmDialog
          triggerLabel="Send back"
          triggerVariant="secondary"
          disabled={pending}
          title={chosen.length ? `Send back the ${listed(chosen)}?` : 'Send back the job card?'}
          description={
            chosen.length
              ? 'The technician redoes what you picked (the whole wheel where no step is ticked). The work recorded there stays on the record but no longer counts, and the assignee is e-mailed.'
              : 'No wheel is ticked yet: a job card goes back with the wheels to redo and what to redo on each.'
          }
          confirmLabel={
            chosen.length ? `Send back the ${listed(chosen)}` : 'Send back the job card'
          }
          onConfirm={() => sendBackForm.current?.requestSubmit()}
        />
      </form>
    </div>
  );
}
