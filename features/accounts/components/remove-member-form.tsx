'use client';

import { Button } from '@/features/ui/button';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { removeTeamMember } from '../actions/remove-member';

export function RemoveMemberForm({ memberId, name }: { memberId: string; name: string }) {
  const { state, formAction, pending } = useFormAction(removeTeamMember);
  return (
    <form
      action={formAction}
      onSubmit={(e) => {
        if (
          !window.confirm(
            `Remove ${name} from the team? They will be signed out and cannot sign in again.`,
          )
        )
          e.preventDefault();
      }}
      className="flex flex-col gap-3"
    >
      <FormMessage state={state} />
      <input type="hidden" name="memberId" value={memberId} />
      <Button variant="danger" disabled={pending}>
        Remove from team
      </Button>
    </form>
  );
}
