import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SignInForm } from '@/features/accounts/components/sign-in-form';
import { getCurrentMember } from '@/server/auth/session';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage() {
  if (await getCurrentMember()) redirect('/board');
  return (
    <>
      <h1 className="text-2xl font-bold">Sign in</h1>
      <SignInForm />
      <p>
        New shop?{' '}
        <Link href="/sign-up" className="font-semibold text-work underline">
          Create your shop
        </Link>
      </p>
    </>
  );
}
