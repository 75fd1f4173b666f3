import type { Metadata } from 'next';
import Link from 'next/link';
import { FinishSignUpForm } from '@/features/accounts/components/finish-sign-up-form';
import { findUsableSignUp, SIGN_UP_UNUSABLE } from '@/features/accounts/server/sign-up-requests';

export const metadata: Metadata = { title: 'Finish creating your shop', referrer: 'no-referrer' };

export default async function FinishSignUpPage({ params }: PageProps<'/sign-up/[token]'>) {
  const { token } = await params;
  const request = token.length <= 200 ? await findUsableSignUp(token) : null;
  if (!request) {
    return (
      <>
        <h1 className="text-2xl font-bold">Link not usable</h1>
        <p role="alert">{SIGN_UP_UNUSABLE}</p>
        <Link href="/sign-up" className="text-work font-semibold underline">
          Sign up again
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="text-2xl font-bold">Finish creating {request.shopName}</h1>
      <p>You become its first lead, signed in as {request.email}.</p>
      <FinishSignUpForm token={token} shopName={request.shopName} />
    </>
  );
}
