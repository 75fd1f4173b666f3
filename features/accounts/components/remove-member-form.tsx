'use client';

import { useRef } from 'react';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { removeTeamMember } from '../actions/remove-member';

export function RemoveMemberForm({ memberId, name }: { memberId: string; name: string }) {
  const { state, formAction, pending } = useFormAction(removeTeamMember, {
    leaves: `${name} was removed from the team.`,
  });
  const form = useRef<HTMLFormElement>(null);
  return (
    <form ref={form} action={formAction} className="flex flex-col gap-3">
      <FormMessage state={state} />
      <input type="hidden" name="memberId" value={memberId} />
      <ConfirmDialog
        triggerLabel="Remove from team"
        title={`Remove ${name} from the team?`}
        description="They are signed out everywhere and cannot sign in again. Their work stays on the record."
        confirmLabel={`Remove ${name}`}
        onConfirm={() => form.current?.requestSubmit()}
        disabled={pending}
      />
    </form>
  );
}
