'use client';

import { Button } from '@/features/ui/button';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { signIn } from '../actions/sign-in';

/** `next`: the page to return to, when the sign-in came from an ended session. */
export function SignInForm({ next }: { next?: string }) {
  const { state, formAction, pending, errors, value } = useFormAction(signIn);
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4">
      <FormMessage state={state} />
      {next ? <input type="hidden" name="next" value={next} /> : null}
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="username"
        required
        defaultValue={value('email')}
        errors={errors('email')}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="current-password"
        required
        errors={errors('password')}
      />
      <Button disabled={pending}>{pending ? 'Signing in…' : 'Sign in'}</Button>
    </form>
  );
}
