import type { Metadata } from 'next';
import { SpecForm } from '@/features/specs/components/spec-form';
import { wrenchesForEngine } from '@/features/tool-crib/server/wrenches';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';

export const metadata: Metadata = { title: 'New wheel spec' };

export default async function NewSpecPage() {
  const member = await requireMember('specs.manage');
  return (
    <>
      <PageHeader title="New wheel spec" />
      <SpecForm wrenches={await wrenchesForEngine(member.shopId)} />
    </>
  );
}
