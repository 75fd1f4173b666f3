'use client';

import { Button } from '@/features/ui/button';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { revokeTeamInvite } from '../actions/revoke-invite';

export function RevokeInviteButton({ inviteId, email }: { inviteId: string; email: string }) {
  const { state, formAction, pending } = useFormAction(revokeTeamInvite);
  return (
    <form action={formAction}>
      <input type="hidden" name="inviteId" value={inviteId} />
      <Button variant="secondary" disabled={pending} aria-label={`Revoke the invite to ${email}`}>
        Revoke
      </Button>
      {state && !state.ok ? <FormMessage state={state} /> : null}
    </form>
  );
}
