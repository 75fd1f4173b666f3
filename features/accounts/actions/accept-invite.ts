'use server';

import { redirect } from 'next/navigation';
import { publicAction } from '@/server/action';
import { homePathFor } from '@/server/auth/return-path';
import { createSessionCookie, setSessionCookie } from '@/server/auth/session';
import { acceptInviteSchema } from '../schemas';
import { acceptInvite } from '../server/invites';

export const acceptTeamInvite = publicAction(acceptInviteSchema, async (input) => {
  const { userId, role } = await acceptInvite(input);
  await setSessionCookie(await createSessionCookie(userId));
  redirect(homePathFor(role));
});
