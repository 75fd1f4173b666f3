import type { Metadata } from 'next';
import Link from 'next/link';
import { WrenchTable } from '@/features/tool-crib/components/wrench-table';
import { listWrenches } from '@/features/tool-crib/server/wrenches';
import { buttonClass } from '@/features/ui/button';
import { EmptyState, PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';

export const metadata: Metadata = { title: 'Tool crib' };

export default async function ToolCribPage() {
  const member = await requireMember('verifications.record');
  const wrenches = await listWrenches(member.shopId);
  const canManage = can(member.role, 'wrenches.manage');
  return (
    <>
      <PageHeader title="Tool crib">
        {canManage ? (
          <Link href="/tool-crib/new" className={buttonClass()}>
            Add a wrench
          </Link>
        ) : null}
      </PageHeader>
      {wrenches.length === 0 ? (
        <EmptyState title="No torque wrenches yet">
          {canManage
            ? 'Add the shop’s torque wrenches with their range, unit and calibration date.'
            : 'A lead adds the shop’s torque wrenches.'}
        </EmptyState>
      ) : (
        <WrenchTable wrenches={wrenches} />
      )}
    </>
  );
}
