'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { changeRoleSchema } from '../schemas';
import { changeRole } from '../server/team';

export const changeMemberRole = memberAction(
  { permission: 'team.manage', schema: changeRoleSchema },
  async (input, member) => {
    const updated = await changeRole(member, input.memberId, input.role);
    revalidatePath('/team');
    return updated;
  },
);
