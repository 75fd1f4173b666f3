'use server';

import { redirect } from 'next/navigation';
import { publicAction } from '@/server/action';
import { createSessionCookie, setSessionCookie } from '@/server/auth/session';
import { confirmSignUpSchema, signUpSchema } from '../schemas';
import { confirmSignUp, requestSignUp } from '../server/sign-up-requests';

/** Step one: the same answer for every address (see requestSignUp). */
export const signUp = publicAction(signUpSchema, async (input) => {
  await requestSignUp(input);
  return { email: input.email };
});

/** Step two, from the link in the e-mail: the shop is created and its lead signed in. */
export const finishSignUp = publicAction(confirmSignUpSchema, async (input) => {
  const { userId } = await confirmSignUp(input.token);
  await setSessionCookie(await createSessionCookie(userId));
  redirect('/board');
});
