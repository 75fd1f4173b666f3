import type { Metadata } from 'next';
import Link from 'next/link';
import { SpecList } from '@/features/specs/components/spec-list';
import { listSpecs } from '@/features/specs/server/specs';
import { buttonClass } from '@/features/ui/button';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Wheel specs' };

export default async function SpecsPage() {
  const member = await requireMember('board.view');
  const canManage = can(member.role, 'specs.manage');
  return (
    <>
      <PageHeader title="Wheel specs">
        {canManage ? (
          <Link href="/specs/new" className={buttonClass()}>
            New spec
          </Link>
        ) : null}
      </PageHeader>
      <SpecList specs={await listSpecs(member.shopId)} canManage={canManage} />
    </>
  );
}
