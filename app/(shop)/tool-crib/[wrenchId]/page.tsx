import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { ClearForm } from '@/features/tool-crib/components/clear-form';
import { HistoryTable } from '@/features/tool-crib/components/history-table';
import { StatusBadge } from '@/features/tool-crib/components/status-badge';
import { VerificationForm } from '@/features/tool-crib/components/verification-form';
import { WrenchForm } from '@/features/tool-crib/components/wrench-form';
import { wrenchIdField } from '@/features/tool-crib/schemas';
import { getWrench, wrenchHistory } from '@/features/tool-crib/server/wrenches';
import { PageHeader } from '@/features/ui/page';
import { requireMember } from '@/server/auth/guard';
import { can } from '@/server/auth/permissions';
import { orNotFound } from '@/server/errors';

export const metadata: Metadata = { title: 'Wrench' };

export default async function WrenchPage({ params }: PageProps<'/tool-crib/[wrenchId]'>) {
  const member = await requireMember('verifications.record');
  const id = wrenchIdField.safeParse((await params).wrenchId);
  if (!id.success) notFound();
  const wrench = await orNotFound(getWrench(member.shopId, id.data));
  const history = await wrenchHistory(member.shopId, wrench.id);
  return (
    <>
      <Link href="/tool-crib" className="text-work font-semibold underline">
        ← Tool crib
      </Link>
      <PageHeader title={wrench.label}>
        <StatusBadge status={wrench.status} />
      </PageHeader>
      {wrench.statusReason ? <p className="mb-4 font-semibold">{wrench.statusReason}</p> : null}
      <div className="grid gap-8 lg:grid-cols-2">
        <div className="flex flex-col gap-8">
          <section
            aria-labelledby="verify-heading"
            className="border-paper-line rounded-xl border-2 p-4"
          >
            <h2 id="verify-heading" className="mb-3 text-xl font-bold">
              Record a verification
            </h2>
            <VerificationForm wrenchId={wrench.id} unit={wrench.unit} />
          </section>
          {wrench.status === 'out_of_service' && can(member.role, 'wrenches.clear') ? (
            <section
              aria-labelledby="clear-heading"
              className="border-danger rounded-xl border-2 p-4"
            >
              <h2 id="clear-heading" className="mb-3 text-xl font-bold">
                Put back in service
              </h2>
              <ClearForm wrenchId={wrench.id} />
            </section>
          ) : null}
          <section aria-labelledby="history-heading">
            <h2 id="history-heading" className="mb-3 text-xl font-bold">
              History
            </h2>
            <HistoryTable entries={history} />
          </section>
        </div>
        {can(member.role, 'wrenches.manage') ? (
          <section aria-labelledby="edit-heading">
            <h2 id="edit-heading" className="mb-3 text-xl font-bold">
              Details
            </h2>
            <WrenchForm wrench={wrench} />
          </section>
        ) : null}
      </div>
    </>
  );
}
