import 'server-only';
import { reportView, type ReportView } from '../view-model';
import { getReportData } from './report-data';
import { openPhoto } from './report-photos';
import { findReportLink } from './report-links';
import { renderReport, type RenderedReport } from './render-report';

/**
 * What a customer's link opens, and nothing more: the one job's report, its PDF, and that job's
 * own photos. Every function answers null for a token that opens nothing (callers give one plain 404).
 */
export async function getPublicReport(token: string): Promise<ReportView | null> {
  const link = await findReportLink(token);
  if (!link) return null;
  return reportView(await getReportData(link.shopId, link.jobId));
}

export async function getPublicReportPdf(token: string): Promise<RenderedReport | null> {
  const link = await findReportLink(token);
  if (!link) return null;
  return renderReport(link.shopId, await getReportData(link.shopId, link.jobId));
}

/**
 * A photo of the link's own job, proxied: the store's URLs never reach the customer. The
 * transfer ends with `signal` (the customer's request).
 */
export async function getPublicPhoto(token: string, photoId: string, signal?: AbortSignal) {
  const link = await findReportLink(token);
  if (!link) return null;
  return openPhoto(link.shopId, link.jobId, photoId, signal);
}
