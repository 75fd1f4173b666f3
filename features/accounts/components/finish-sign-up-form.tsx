'use client';

import { Button } from '@/features/ui/button';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { finishSignUp } from '../actions/sign-up';

/** A button, not a page load, creates the shop: mail scanners that open links create nothing. */
export function FinishSignUpForm({ token, shopName }: { token: string; shopName: string }) {
  const { state, formAction, pending } = useFormAction(finishSignUp);
  return (
    <form action={formAction} className="flex flex-col gap-4">
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <Button disabled={pending}>
        {pending ? 'Creating your shop…' : `Create ${shopName} and sign in`}
      </Button>
    </form>
  );
}
