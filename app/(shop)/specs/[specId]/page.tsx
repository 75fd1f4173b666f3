import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { SpecForm } from '@/features/specs/components/spec-form';
import { specToInput } from '@/features/specs/engine-check';
import { SpecFlag } from '@/features/specs/components/spec-flag';
import { SpecPreview } from '@/features/specs/components/spec-preview';
import { specIdField } from '@/features/specs/schemas';
import { getSpec } from '@/features/specs/server/specs';
import { wrenchesForEngine } from '@/features/tool-crib/server/wrenches';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { orNotFound } from '@/server/errors';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'Wheel spec' };

export default async function SpecPage({ params }: PageProps<'/specs/[specId]'>) {
  const member = await requireMember('board.view');
  const id = specIdField.safeParse((await params).specId);
  if (!id.success) notFound();
  const [spec, wrenches, settings] = await Promise.all([
    orNotFound(getSpec(member.shopId, id.data)),
    wrenchesForEngine(member.shopId),
    getShopSettings(member.shopId),
  ]);
  const minFractionOfMax = settings.wrenchFloorPercent / 100;
  return (
    <>
      <Link href="/specs" className="text-work font-semibold underline">
        ← Wheel specs
      </Link>
      <PageHeader title={spec.name} />
      {can(member.role, 'specs.manage') ? (
        <SpecForm
          spec={spec}
          wrenches={wrenches}
          minFractionOfMax={minFractionOfMax}
          units={{ torque: settings.torqueUnit, pressure: settings.pressureUnit }}
        />
      ) : (
        <>
          {spec.plausibilityFlag ? (
            <SpecFlag reason={spec.plausibilityFlag} canFix={false} />
          ) : null}
          <SpecPreview
            spec={specToInput(spec)}
            wrenches={wrenches}
            minFractionOfMax={minFractionOfMax}
          />
        </>
      )}
    </>
  );
}
