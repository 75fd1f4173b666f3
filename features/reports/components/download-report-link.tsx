import { buttonClass } from '@/features/ui/button';

/** The signed-off job's PDF, straight from the report route (which checks the role again). */
export function DownloadReportLink({ jobId }: { jobId: string }) {
  return (
    <a
      href={`/api/jobs/${jobId}/report`}
      download
      className={buttonClass('secondary', 'print:hidden')}
    >
      Download report
    </a>
  );
}
