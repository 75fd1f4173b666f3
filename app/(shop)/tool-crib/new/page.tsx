import type { Metadata } from 'next';
import { WrenchForm } from '@/features/tool-crib/components/wrench-form';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'Add a wrench' };

export default async function NewWrenchPage() {
  await requireMember('wrenches.manage');
  return (
    <>
      <PageHeader title="Add a wrench" />
      <div className="max-w-lg">
        <WrenchForm />
      </div>
    </>
  );
}
