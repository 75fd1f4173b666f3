'use server';

import { revalidatePath } from 'next/cache';
import { redirect } from 'next/navigation';
import { memberAction } from '@/server/action';
import { removeMemberSchema } from '../schemas';
import { removeMember } from '../server/team';

export const removeTeamMember = memberAction(
  { permission: 'team.manage', schema: removeMemberSchema },
  async (input, member) => {
    await removeMember(member, input.memberId);
    revalidatePath('/team');
    redirect('/team');
  },
);
