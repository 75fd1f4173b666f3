import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SignUpForm } from '@/features/accounts/components/sign-up-form';
import { homePathFor } from '@/server/auth/return-path';
import { getCurrentMember } from '@/server/auth/session';

export const metadata: Metadata = { title: 'Create your shop' };

export default async function SignUpPage() {
  const member = await getCurrentMember();
  if (member) redirect(homePathFor(member.role));
  return (
    <>
      <h1 className="text-2xl font-bold">Create your shop</h1>
      <p className="text-ink-soft">
        You become the shop&apos;s first lead and can invite your team.
      </p>
      <SignUpForm />
      <p>
        Already on Ringpass?{' '}
        <Link href="/sign-in" className="text-work font-semibold underline">
          Sign in
        </Link>
      </p>
    </>
  );
}
