'use client';

import { Button } from '@/features/ui/button';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { acceptTeamInvite } from '../actions/accept-invite';

export function AcceptInviteForm({ token, email }: { token: string; email: string }) {
  const { state, formAction, pending, errors, value } = useFormAction(acceptTeamInvite);
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4">
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <TextField
        label="E-mail"
        name="email-shown"
        value={email}
        readOnly
        autoComplete="username"
        hint="The address the invite was sent to."
      />
      <TextField
        label="Your name"
        name="name"
        autoComplete="name"
        required
        defaultValue={value('name')}
        errors={errors('name')}
      />
      <TextField
        label="Choose a password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 12 characters."
        errors={errors('password')}
      />
      <Button disabled={pending}>{pending ? 'Joining…' : 'Join the shop'}</Button>
    </form>
  );
}
