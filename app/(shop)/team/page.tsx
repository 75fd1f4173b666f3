import type { Metadata } from 'next';
import { InviteForm } from '@/features/accounts/components/invite-form';
import { TeamList } from '@/features/accounts/components/team-list';
import { listPendingInvites } from '@/features/accounts/server/invites';
import { listTeam } from '@/features/accounts/server/team';
import { ClearanceBadge } from '@/features/practice/components/clearance-badge';
import { listApprenticeStanding } from '@/features/practice/server/clearances';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'Team' };

export default async function TeamPage() {
  const member = await requireMember('team.manage');
  const [members, invites, apprentices] = await Promise.all([
    listTeam(member.shopId),
    listPendingInvites(member.shopId),
    listApprenticeStanding(member.shopId),
  ]);
  // Practice's clearance shown beside each apprentice: features meet here, not in each other.
  const standing = Object.fromEntries(
    apprentices.map((a) => [a.userId, <ClearanceBadge key={a.userId} standing={a} />]),
  );
  return (
    <>
      <PageHeader title="Team" />
      <div className="grid gap-8 md:grid-cols-[2fr_1fr]">
        <TeamList members={members} invites={invites} standing={standing} />
        <section
          aria-labelledby="invite-heading"
          className="border-paper-line rounded-xl border-2 p-4"
        >
          <h2 id="invite-heading" className="mb-3 text-xl font-bold">
            Invite someone
          </h2>
          <InviteForm />
        </section>
      </div>
    </>
  );
}
