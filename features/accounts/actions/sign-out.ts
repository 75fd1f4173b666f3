'use server';

import { redirect } from 'next/navigation';
import { endSession, getCurrentMember } from '@/server/auth/session';

/** Ends this session on the server (not only the cookie), then goes to sign-in. */
export async function signOut(): Promise<void> {
  const member = await getCurrentMember();
  if (member) await endSession(member.sessionId);
  redirect('/sign-in');
}
