'use client';

import type { Role } from '@/db/schema';
import { Button } from '@/features/ui/button';
import { SelectField } from '@/features/ui/field';
import { FormMessage } from '@/features/ui/form-message';
import { useFormAction } from '@/features/ui/use-form-action';
import { changeMemberRole } from '../actions/change-role';
import { ROLE_OPTIONS } from './role-options';

export function MemberRoleForm({ memberId, role }: { memberId: string; role: Role }) {
  const { state, formAction, pending, errors } = useFormAction(changeMemberRole);
  const shown = state?.ok
    ? { ok: true, message: `Role changed to ${state.data.role}. Their sessions were ended.` }
    : state;
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4">
      <FormMessage state={shown} />
      <input type="hidden" name="memberId" value={memberId} />
      <SelectField
        label="Role"
        name="role"
        options={ROLE_OPTIONS}
        defaultValue={role}
        errors={errors('role')}
        hint="Changing a role signs the person out everywhere."
      />
      <Button disabled={pending}>Save role</Button>
    </form>
  );
}
