'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { revokeInviteSchema } from '../schemas';
import { revokeInvite } from '../server/invites';

export const revokeTeamInvite = memberAction(
  { permission: 'team.manage', schema: revokeInviteSchema },
  async (input, member) => {
    await revokeInvite(member, input.inviteId);
    revalidatePath('/team');
    return { revoked: input.inviteId };
  },
);
