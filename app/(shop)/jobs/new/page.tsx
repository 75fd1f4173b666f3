import type { Metadata } from 'next';
import Link from 'next/link';
import { JobForm } from '@/features/jobs/components/job-form';
import { listCustomers, listVehicles, vehicleLabel } from '@/features/jobs/server/customers';
import { listAssignees } from '@/features/jobs/server/jobs';
import { listSpecs } from '@/features/specs/server/specs';
import { EmptyState, PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { getShopSettings } from '@/server/shop/settings';

export const metadata: Metadata = { title: 'New job card' };

export default async function NewJobPage() {
  const member = await requireMember('jobs.create');
  const [customers, vehicles, specs, people, settings] = await Promise.all([
    listCustomers(member.shopId, { page: 1, pageSize: 500 }),
    listVehicles(member.shopId, { page: 1, pageSize: 2000 }),
    listSpecs(member.shopId),
    listAssignees(member.shopId),
    getShopSettings(member.shopId),
  ]);
  const canAssign = can(member.role, 'jobs.assign');
  return (
    <>
      <PageHeader title="New job card" />
      {specs.length === 0 ? (
        <EmptyState title="No wheel specs yet">
          A job card needs a wheel spec for each wheel.{' '}
          {can(member.role, 'specs.manage') ? (
            <Link href="/specs/new" className="text-work font-semibold underline">
              Create a spec first
            </Link>
          ) : (
            'Ask a lead to create one.'
          )}
        </EmptyState>
      ) : (
        <JobForm
          customers={customers.data}
          vehicles={vehicles.data.map((v) => ({ ...v, label: vehicleLabel(v) }))}
          specs={specs.map((s) => ({
            id: s.id,
            name: s.name,
            runningPressure: s.runningPressure,
            pressureUnit: s.pressureUnit,
          }))}
          assignees={canAssign ? people : people.filter((p) => p.id === member.userId)}
          canAcceptVin={can(member.role, 'jobs.edit')}
          pressureUnit={settings.pressureUnit}
        />
      )}
    </>
  );
}
