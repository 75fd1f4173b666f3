import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { MemberRoleForm } from '@/features/accounts/components/member-role-form';
import { RemoveMemberForm } from '@/features/accounts/components/remove-member-form';
import { memberIdField } from '@/features/accounts/schemas';
import { getTeamMember } from '@/features/accounts/server/team';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { orNotFound } from '@/server/errors';

export const metadata: Metadata = { title: 'Team member' };

export default async function MemberPage({ params }: PageProps<'/team/[memberId]'>) {
  const member = await requireMember('team.manage');
  const id = memberIdField.safeParse((await params).memberId);
  if (!id.success) notFound();
  const person = await orNotFound(getTeamMember(member.shopId, id.data));
  return (
    <>
      <Link href="/team" className="text-work font-semibold underline">
        ← Team
      </Link>
      <PageHeader title={person.name} />
      <p className="text-ink-soft mb-6">{person.email}</p>
      <div className="grid max-w-md gap-8">
        <MemberRoleForm memberId={person.id} role={person.role} />
        {person.id !== member.userId ? (
          <RemoveMemberForm memberId={person.id} name={person.name} />
        ) : null}
      </div>
    </>
  );
}
