'use client';

import { useRef } from 'react';
import { Button } from '@/features/ui/button';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import {
  cancelRecheckReminder,
  rescheduleRecheckReminder,
  sendCustomerEmailAgain,
} from '../actions/follow-up-actions';

type Outcome = { ok: true; data: { message: string } } | { ok: false; message: string } | null;
const shown = (state: Outcome) => (state?.ok ? { ok: true, message: state.data.message } : state);

/** A lead's controls for the reminder: move it to a day (also to send it again), or cancel it. */
export function RecheckControls({
  jobId,
  dueOn,
  canCancel,
}: {
  jobId: string;
  dueOn: string;
  canCancel: boolean;
}) {
  const move = useFormAction(rescheduleRecheckReminder);
  const cancel = useFormAction(cancelRecheckReminder);
  const cancelForm = useRef<HTMLFormElement>(null);
  return (
    <div className="flex flex-col gap-3">
      <form action={move.formAction} noValidate className="flex flex-col gap-2">
        <FormMessage state={shown(move.state)} />
        <input type="hidden" name="jobId" value={jobId} />
        <TextField
          label="Re-check due on"
          name="dueOn"
          type="date"
          defaultValue={move.value('dueOn') ?? dueOn}
          errors={move.errors('dueOn')}
        />
        <Button variant="secondary" disabled={move.pending}>
          Reschedule
        </Button>
      </form>
      {canCancel ? (
        <form ref={cancelForm} action={cancel.formAction}>
          <FormMessage state={shown(cancel.state)} />
          <input type="hidden" name="jobId" value={jobId} />
          <ConfirmDialog
            triggerLabel="Cancel reminder"
            title="Cancel the re-check reminder?"
            description="The customer will not be reminded to have the ring bolts re-checked after the first ride. Reschedule instead if only the day is wrong."
            confirmLabel="Cancel the reminder"
            cancelLabel="Keep the reminder"
            onConfirm={() => cancelForm.current?.requestSubmit()}
            disabled={cancel.pending}
          />
        </form>
      ) : null}
    </div>
  );
}

/** "Send again" for the customer's completion e-mail. */
export function SendAgainButton({ jobId }: { jobId: string }) {
  const { state, formAction, pending } = useFormAction(sendCustomerEmailAgain);
  return (
    <form action={formAction} className="flex flex-col gap-2">
      <FormMessage state={shown(state)} />
      <input type="hidden" name="jobId" value={jobId} />
      <Button variant="secondary" disabled={pending}>
        Send again
      </Button>
    </form>
  );
}
