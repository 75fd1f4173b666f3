'use server';

import { headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { publicAction } from '@/server/action';
import { homePathFor, returnPath } from '@/server/auth/return-path';
import { createSessionCookie, setSessionCookie } from '@/server/auth/session';
import { clientAddress } from '@/server/http/request-meta';
import { signInSchema } from '../schemas';
import { authenticate } from '../server/accounts';

export const signIn = publicAction(signInSchema, async (input) => {
  const { userId, role } = await authenticate(input, clientAddress(await headers()));
  await setSessionCookie(await createSessionCookie(userId));
  redirect(returnPath(input.next) ?? homePathFor(role));
});
