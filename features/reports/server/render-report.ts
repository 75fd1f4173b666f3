import 'server-only';
import { DomainError } from '@/server/errors';
import type { ReportData } from '../types';
import { reportView, type ReportView } from '../view-model';
import { getReportData } from './report-data';
import { loadReportImages } from './report-photos';

export type RenderedReport = { pdf: Buffer; filename: string; view: ReportView };

export const reportFilename = (jobNumber: number) => `job-${jobNumber}-report.pdf`;

/** Before sign-off there is no report to give: the record may still change. */
export function assertReportReady(data: ReportData): asserts data is ReportData & {
  signOff: NonNullable<ReportData['signOff']>;
} {
  if (data.job.state !== 'signed_off' || !data.signOff)
    throw new DomainError('conflict', 'The report is ready once a lead has signed the job off.');
}

export async function renderReport(shopId: string, data: ReportData): Promise<RenderedReport> {
  assertReportReady(data);
  const view = reportView(data);
  // The PDF library loads with the first report, not with every process that could build one
  // (the Next server preloads each route's modules at start, the worker its handlers'); its
  // loading overlaps the photos' fetching.
  const [images, { renderReportPdf }] = await Promise.all([
    loadReportImages(
      shopId,
      data.job.id,
      data.wheels.flatMap((w) => w.photos.map((p) => p.id)),
    ),
    import('../pdf/render-pdf'),
  ]);
  const pdf = await renderReportPdf(view, images);
  return { pdf, filename: reportFilename(data.job.number), view };
}

/** The PDF of a signed-off job of this shop; another shop's job is not found, an unsigned one a conflict. */
export async function renderJobReport(shopId: string, jobId: string): Promise<RenderedReport> {
  return renderReport(shopId, await getReportData(shopId, jobId));
}
