'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { inviteSchema } from '../schemas';
import { createInvite } from '../server/invites';

export const inviteMember = memberAction(
  { permission: 'team.manage', schema: inviteSchema },
  async (input, member) => {
    const invite = await createInvite(member, input);
    revalidatePath('/team');
    return invite;
  },
);
