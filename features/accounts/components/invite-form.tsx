'use client';

import { Button } from '@/features/ui/button';
import { SelectField, TextField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { inviteMember } from '../actions/invite-member';
import { ROLE_OPTIONS } from './role-options';

export function InviteForm() {
  const { state, formAction, pending, errors, value } = useFormAction(inviteMember);
  const shown = state?.ok ? { ok: true, message: `Invite sent to ${state.data.email}.` } : state;
  return (
    <form
      action={formAction}
      noValidate
      className="flex flex-col gap-4"
      aria-label="Invite a team member"
    >
      <FormMessage state={shown} />
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="off"
        required
        defaultValue={value('email')}
        errors={errors('email')}
      />
      <SelectField
        label="Role"
        name="role"
        options={ROLE_OPTIONS}
        defaultValue={value('role') ?? 'technician'}
        errors={errors('role')}
      />
      <Button disabled={pending}>{pending ? 'Sending…' : 'Send invite'}</Button>
    </form>
  );
}
