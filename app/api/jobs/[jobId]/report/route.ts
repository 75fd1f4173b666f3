import { reportParams } from '@/features/reports/schemas';
import { pdfResponse } from '@/features/reports/server/pdf-response';
import { renderJobReport } from '@/features/reports/server/render-report';
import { apiRoute } from '@/server/http/handler';

/** The signed-off job's completion report as a PDF download (409 until a lead has signed it off). */
export const GET = apiRoute(
  { permission: 'reports.download', params: reportParams },
  async ({ member, params }) => {
    const { pdf, filename } = await renderJobReport(member.shopId, params.jobId);
    return pdfResponse(pdf, filename, 'attachment');
  },
);
