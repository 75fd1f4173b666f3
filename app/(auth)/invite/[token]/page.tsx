import type { Metadata } from 'next';
import Link from 'next/link';
import { AcceptInviteForm } from '@/features/accounts/components/accept-invite-form';
import { findUsableInvite, INVITE_UNUSABLE } from '@/features/accounts/server/invites';
import { ROLE_LABELS } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Join your shop', referrer: 'no-referrer' };

export default async function InvitePage({ params }: PageProps<'/invite/[token]'>) {
  const { token } = await params;
  const invite = token.length <= 200 ? await findUsableInvite(token) : null;
  if (!invite) {
    return (
      <>
        <h1 className="text-2xl font-bold">Invite not usable</h1>
        <p role="alert">{INVITE_UNUSABLE}</p>
        <Link href="/sign-in" className="text-work font-semibold underline">
          Go to sign-in
        </Link>
      </>
    );
  }
  return (
    <>
      <h1 className="text-2xl font-bold">Join {invite.shopName}</h1>
      <p>
        You were invited as a <strong>{ROLE_LABELS[invite.role].toLowerCase()}</strong>.
      </p>
      <AcceptInviteForm token={token} email={invite.email} />
    </>
  );
}
