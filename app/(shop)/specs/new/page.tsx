import type { Metadata } from 'next';
import { SpecForm } from '@/features/specs/components/spec-form';
import { wrenchesForEngine } from '@/features/tool-crib/server/wrenches';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'New wheel spec' };

export default async function NewSpecPage() {
  const member = await requireMember('specs.manage');
  const [wrenches, settings] = await Promise.all([
    wrenchesForEngine(member.shopId),
    getShopSettings(member.shopId),
  ]);
  return (
    <>
      <PageHeader title="New wheel spec" />
      <SpecForm
        wrenches={wrenches}
        minFractionOfMax={settings.wrenchFloorPercent / 100}
        units={{ torque: settings.torqueUnit, pressure: settings.pressureUnit }}
      />
    </>
  );
}
