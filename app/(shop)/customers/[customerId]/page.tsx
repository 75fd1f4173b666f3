import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { CustomerForm, VehicleForm } from '@/features/jobs/components/customer-forms';
import { ids } from '@/features/jobs/schemas';
import { getCustomer, listVehicles, vehicleLabel } from '@/features/jobs/server/customers';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { orNotFound } from '@/server/errors';

export const metadata: Metadata = { title: 'Customer' };

export default async function CustomerPage({ params }: PageProps<'/customers/[customerId]'>) {
  const member = await requireMember('jobs.create');
  const id = ids.customer.safeParse((await params).customerId);
  if (!id.success) notFound();
  const customer = await orNotFound(getCustomer(member.shopId, id.data));
  const vehicles = await listVehicles(member.shopId, {
    page: 1,
    pageSize: 100,
    customerId: customer.id,
  });
  const canEdit = can(member.role, 'jobs.edit');
  return (
    <>
      <Link href="/customers" className="text-work font-semibold underline">
        ← Customers
      </Link>
      <PageHeader title={customer.name} />
      <div className="grid gap-8 md:grid-cols-2">
        <section aria-labelledby="vehicles-heading" className="flex flex-col gap-4">
          <h2 id="vehicles-heading" className="text-xl font-bold">
            Vehicles ({vehicles.total})
          </h2>
          <ul className="flex flex-col gap-2">
            {vehicles.data.map((v) => (
              <li key={v.id} className="border-paper-line rounded-xl border-2 p-3">
                <span className="font-semibold">{vehicleLabel(v)}</span>
                {v.description && vehicleLabel(v) !== v.description ? (
                  <span className="text-ink-soft block">{v.description}</span>
                ) : null}
                {v.vin ? (
                  <span className="block text-sm">
                    VIN {v.vin}
                    {v.vinCheckOverridden ? ' (check digit accepted by a lead)' : ''}
                  </span>
                ) : null}
              </li>
            ))}
          </ul>
          <VehicleForm customerId={customer.id} canAcceptVin={canEdit} />
        </section>
        {canEdit ? (
          <section aria-labelledby="edit-heading">
            <h2 id="edit-heading" className="mb-3 text-xl font-bold">
              Details
            </h2>
            <CustomerForm customer={customer} />
          </section>
        ) : null}
      </div>
    </>
  );
}
