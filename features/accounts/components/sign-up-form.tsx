'use client';

import { useSyncExternalStore } from 'react';
import { Button } from '@/features/ui/button';
import { TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { signUp } from '../actions/sign-up';

const noChange = () => () => {};
const browserTimeZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;

export function SignUpForm() {
  const { state, formAction, pending, errors, value } = useFormAction(signUp);
  // The new shop's clock starts as this browser's; the server checks the name (else UTC).
  const timeZone = useSyncExternalStore(noChange, browserTimeZone, () => '');
  // The same answer for every address: whether it already has an account is told only by e-mail.
  if (state?.ok) {
    return (
      <p
        role="status"
        className="border-ok bg-ok-tint text-ok rounded-lg border-2 p-3 font-semibold"
      >
        Check your e-mail at {state.data.email}. The link in it finishes creating your shop.
      </p>
    );
  }
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4">
      <FormMessage state={state} />
      <input type="hidden" name="timeZone" value={timeZone} />
      <TextField
        label="Shop name"
        name="shopName"
        autoComplete="organization"
        required
        defaultValue={value('shopName')}
        errors={errors('shopName')}
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
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        defaultValue={value('email')}
        errors={errors('email')}
      />
      <TextField
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 12 characters. A short sentence works well."
        errors={errors('password')}
      />
      <Button disabled={pending}>{pending ? 'Sending…' : 'Create shop'}</Button>
    </form>
  );
}
