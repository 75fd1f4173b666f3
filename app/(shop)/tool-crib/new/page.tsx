import type { Metadata } from 'next';
import { WrenchForm } from '@/features/tool-crib/components/wrench-form';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'Add a wrench' };

export default async function NewWrenchPage() {
  const member = await requireMember('wrenches.manage');
  const { torqueUnit } = await getShopSettings(member.shopId);
  return (
    <>
      <PageHeader title="Add a wrench" />
      <div className="max-w-lg">
        <WrenchForm defaultUnit={torqueUnit} />
      </div>
    </>
  );
}
