import type { Metadata } from 'next';
import { SettingsForm } from '@/features/settings/components/settings-form';
import { PageHeader } from '@/features/ui/page';
import { timeZoneNames } from '@/features/ui/time-zone-names';
import { requireMember } from '@/server/auth/guard';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'Settings' };

export default async function SettingsPage() {
  const member = await requireMember('shop.settings', '/settings');
  return (
    <>
      <PageHeader title="Shop settings" />
      <SettingsForm settings={await getShopSettings(member.shopId)} timeZones={timeZoneNames()} />
    </>
  );
}
