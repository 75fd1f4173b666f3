import { tokenParams } from '@/features/reports/schemas';
import { pdfResponse } from '@/features/reports/server/pdf-response';
import { getPublicReportPdf } from '@/features/reports/server/public-report';
import { publicNotFound } from '@/features/reports/server/public-response';

/** The customer's PDF, opened in the browser; the link's token is the only key (no session). */
export async function GET(_request: Request, { params }: RouteContext<'/r/[token]/report.pdf'>) {
  const parsed = tokenParams.safeParse(await params);
  const report = parsed.success ? await getPublicReportPdf(parsed.data.token) : null;
  if (!report) return publicNotFound();
  const res = pdfResponse(report.pdf, report.filename, 'inline');
  res.headers.set('x-robots-tag', 'noindex, nofollow');
  res.headers.set('referrer-policy', 'no-referrer');
  return res;
}
