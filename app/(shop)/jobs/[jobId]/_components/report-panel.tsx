import { CustomerLinks } from '@/features/reports/components/customer-links';
import { DownloadReportLink } from '@/features/reports/components/download-report-link';
import { listActiveReportLinks } from '@/features/reports/server/report-links';
import { formatShopTime } from '@/features/ui/shop-time';
import { can } from '@/server/auth/permissions';
import type { Member } from '@/server/auth/session';
import { getShopSettings } from '@/server/shop/settings';

/** The job page's report panel: Download report for a signed-off job, and a lead's customer links. */
export async function ReportPanel({
  member,
  jobId,
  state,
}: {
  member: Member;
  jobId: string;
  state: string;
}) {
  if (state !== 'signed_off' || !can(member.role, 'reports.download')) return null;
  const manage = can(member.role, 'reports.links');
  const [links, { timeZone }] = await Promise.all([
    manage ? listActiveReportLinks(member.shopId, jobId) : [],
    getShopSettings(member.shopId),
  ]);
  return (
    <section className="flex flex-col gap-3 print:hidden" aria-label="Completion report">
      <h2 className="text-lg font-bold">Completion report</h2>
      <DownloadReportLink jobId={jobId} />
      {manage ? (
        <CustomerLinks
          jobId={jobId}
          links={links.map((l) => ({
            id: l.id,
            created: formatShopTime(l.createdAt, timeZone),
            expires: formatShopTime(l.expiresAt, timeZone, 'date'),
          }))}
        />
      ) : null}
    </section>
  );
}
