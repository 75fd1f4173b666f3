'use client';

import { useRef } from 'react';
import { Button } from '@/features/ui/button';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { moveJobCard } from '../actions/job-actions';
import { STATE_LABELS, TRANSITION_RULES, type TransitionName } from '../transitions';

/**
 * The moves this member may make on this job card now; the server checks each again.
 * `selfReview`: this lead worked on the job and may review it only under the single-lead setting,
 * with a written reason.
 */
export function TransitionForm({
  jobId,
  allowed,
  selfReview = false,
}: {
  jobId: string;
  allowed: TransitionName[];
  selfReview?: boolean;
}) {
  const { state, formAction, pending, errors } = useFormAction(moveJobCard);
  const form = useRef<HTMLFormElement>(null);
  const sendBack = useRef<HTMLButtonElement>(null);
  if (!allowed.length && !state) return null;
  const shown = state?.ok
    ? { ok: true, message: `Job card is now ${STATE_LABELS[state.data.state].toLowerCase()}.` }
    : state;
  return (
    <form
      ref={form}
      action={formAction}
      noValidate
      className="flex flex-col gap-3"
      aria-label="Move the job card"
    >
      <FormMessage state={shown} />
      <input type="hidden" name="jobId" value={jobId} />
      {selfReview && allowed.includes('sign_off') ? (
        <TextField
          label="You worked on this job: why are you signing it off yourself? (required, kept on the record)"
          name="note"
          errors={errors('note')}
        />
      ) : allowed.includes('send_back') ? (
        <TextField label="Note (required to send back)" name="note" errors={errors('note')} />
      ) : null}
      <div className="flex flex-wrap gap-2">
        {allowed.map((t) =>
          t === 'send_back' ? (
            <ConfirmDialog
              key={t}
              triggerLabel={TRANSITION_RULES[t].label}
              triggerVariant="secondary"
              disabled={pending}
              title="Send the whole job card back?"
              description="Every wheel goes back to the technician to redo; the work recorded stays on the record but no longer counts. To send back only some wheels or steps, use the review."
              confirmLabel="Send back every wheel"
              // The hidden button is the submitter, so the form data names the move.
              onConfirm={() => form.current?.requestSubmit(sendBack.current)}
            />
          ) : (
            <Button key={t} name="action" value={t} disabled={pending}>
              {TRANSITION_RULES[t].label}
            </Button>
          ),
        )}
      </div>
      {allowed.includes('send_back') ? (
        <button ref={sendBack} type="submit" name="action" value="send_back" hidden />
      ) : null}
    </form>
  );
}
