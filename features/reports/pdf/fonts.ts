import path from 'node:path';
import { Font } from '@react-pdf/renderer';

export const REPORT_FONT = 'Report Sans';
let registered = false;

/**
 * The report's font from the repository's fonts/ folder, never fetched. Liberation Sans: the PDF
 * library subsets static TrueType fonts, and cannot subset the app's variable Inter.
 */
export function registerReportFonts() {
  if (registered) return;
  const dir = path.join(process.cwd(), 'fonts');
  Font.register({
    family: REPORT_FONT,
    fonts: [
      { src: path.join(dir, 'LiberationSans-Regular.ttf'), fontWeight: 400 },
      { src: path.join(dir, 'LiberationSans-Bold.ttf'), fontWeight: 700 },
    ],
  });
  // Whole words only: a torque or a VIN split across lines with a hyphen misreads.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
