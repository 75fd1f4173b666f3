'use client';

import { useRef } from 'react';
import { ConfirmDialog } from '@/features/ui/confirm-dialog';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { revokeTeamInvite } from '../actions/revoke-invite';

export function RevokeInviteButton({ inviteId, email }: { inviteId: string; email: string }) {
  const { state, formAction, pending } = useFormAction(revokeTeamInvite, {
    leaves: `The invite to ${email} was revoked.`,
  });
  const form = useRef<HTMLFormElement>(null);
  return (
    <form ref={form} action={formAction}>
      <input type="hidden" name="inviteId" value={inviteId} />
      <ConfirmDialog
        triggerLabel="Revoke"
        triggerAriaLabel={`Revoke the invite to ${email}`}
        triggerVariant="secondary"
        title={`Revoke the invite to ${email}?`}
        description="The link in their e-mail stops working. You can invite them again later."
        confirmLabel="Revoke invite"
        onConfirm={() => form.current?.requestSubmit()}
        disabled={pending}
      />
      {state && !state.ok ? <FormMessage state={state} /> : null}
    </form>
  );
}
