import { renderToBuffer } from '@react-pdf/renderer';
import type { ReportView } from '../view-model';
import { registerReportFonts } from './fonts';
import { ReportDocument } from './report-document';
import type { PhotoImage } from './wheel-section';

/** The report's PDF. Loaded only when a report is built (the PDF library weighs ~45 MB). */
export async function renderReportPdf(
  view: ReportView,
  images: Record<string, PhotoImage | null>,
): Promise<Buffer> {
  registerReportFonts();
  return renderToBuffer(<ReportDocument view={view} images={images} />);
}
