'use client';

import { useRef } from 'react';
import { Button } from '@/features/ui/button';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { clearForRealWheels, revokeRealWheelsClearance } from '../actions/clearance-actions';

/** The lead's control: clear an apprentice for real wheels (with a note), or take it back. */
export function ClearanceForm({
  userId,
  name,
  cleared,
}: {
  userId: string;
  name: string;
  cleared: boolean;
}) {
  const clear = useFormAction(clearForRealWheels);
  const revoke = useFormAction(revokeRealWheelsClearance);
  const revokeForm = useRef<HTMLFormElement>(null);
  if (cleared) {
    return (
      <form ref={revokeForm} action={revoke.formAction} className="flex flex-col gap-2">
        <input type="hidden" name="userId" value={userId} />
        <ConfirmDialog
          triggerLabel={`Revoke ${name}’s clearance`}
          triggerVariant="secondary"
          title={`Revoke ${name}’s clearance for real wheels?`}
          description="They go back to practice only: real wheels are refused to them until you clear them again."
          confirmLabel={`Revoke ${name}’s clearance`}
          onConfirm={() => revokeForm.current?.requestSubmit()}
          disabled={revoke.pending}
        />
        <FormMessage state={revoke.state} />
      </form>
    );
  }
  const noteId = `clear-note-${userId}`;
  const errors = clear.errors('note');
  return (
    <form action={clear.formAction} className="flex flex-col gap-2">
      <input type="hidden" name="userId" value={userId} />
      <label htmlFor={noteId} className="font-semibold">
        Note (optional)
      </label>
      <textarea
        id={noteId}
        name="note"
        rows={2}
        maxLength={500}
        defaultValue={clear.value('note')}
        aria-invalid={errors?.length ? true : undefined}
        className="border-ink-soft bg-paper text-ink rounded-lg border-2 p-2"
        placeholder="What you saw them do well"
      />
      {errors?.length ? (
        <p className="text-danger text-sm font-semibold" role="alert">
          {errors.join(' ')}
        </p>
      ) : null}
      <Button disabled={clear.pending}>Clear {name} for real wheels</Button>
      <FormMessage state={clear.state} />
    </form>
  );
}
