'use server';

import { redirect } from 'next/navigation';
import { publicAction } from '@/server/action';
import { createSessionCookie, setSessionCookie } from '@/server/auth/session';
import { signUpSchema } from '../schemas';
import { createShopWithLead } from '../server/accounts';

export const signUp = publicAction(signUpSchema, async (input) => {
  const { userId } = await createShopWithLead(input);
  await setSessionCookie(await createSessionCookie(userId));
  redirect('/board');
});
