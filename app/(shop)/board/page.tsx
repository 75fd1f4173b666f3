import type { Metadata } from 'next';
import { BoardEmpty } from '@/features/jobs/components/board-empty';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Board' };

export default async function BoardPage() {
  const member = await requireMember('board.view');
  return (
    <>
      <PageHeader title="Board" />
      <BoardEmpty canManageTeam={can(member.role, 'team.manage')} />
    </>
  );
}
