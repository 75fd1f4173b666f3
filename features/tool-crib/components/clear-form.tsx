'use client';

import { Button } from '@/features/ui/button';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { putBackInService } from '../actions/wrench-actions';

export function ClearForm({ wrenchId }: { wrenchId: string }) {
  const { state, formAction, pending, errors, value } = useFormAction(putBackInService);
  return (
    <form
      action={formAction}
      noValidate
      className="flex flex-col gap-4"
      aria-label="Put back in service"
    >
      <FormMessage
        state={state?.ok ? { ok: true, message: 'The wrench is back in service.' } : state}
      />
      <input type="hidden" name="wrenchId" value={wrenchId} />
      <TextField
        label="Reason"
        name="reason"
        required
        defaultValue={value('reason')}
        errors={errors('reason')}
        hint="e.g. recalibrated by the lab, certificate on file."
      />
      <Button disabled={pending}>Put back in service</Button>
    </form>
  );
}
