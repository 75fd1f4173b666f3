import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/features/accounts/components/sign-in-form';
import { homePathFor, returnPath } from '@/server/auth/return-path';
import { getCurrentMember } from '@/server/auth/session';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: PageProps<'/sign-in'>) {
  const next = returnPath((await searchParams).next) ?? undefined;
  const member = await getCurrentMember();
  if (member) redirect(next ?? homePathFor(member.role));
  return (
    <>
      <h1 className="text-2xl font-bold">Sign in</h1>
      {next ? (
        <p className="font-semibold">
          Sign in to go back to where you were. Nothing waiting on this device is lost.
        </p>
      ) : null}
      <SignInForm next={next} />
      <p>
        New shop?{' '}
        <Link href="/sign-up" className="text-work font-semibold underline">
          Create your shop
        </Link>
      </p>
    </>
  );
}
