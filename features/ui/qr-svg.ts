import 'server-only';
import { toString as renderQr } from 'qrcode';

/**
 * A QR code as an inline SVG string, drawn on the server: the page needs no script and fetches
 * nothing to show it, and a printed card carries it as vector paths that stay sharp on paper.
 *
 * Error correction M (about 15 % of the symbol recoverable, the library's default level) survives
 * a creased or smudged card on a tire cart; the library's default quiet zone of 4 modules is the
 * margin scanners expect (QR code standard, from memory). The code holds `text` and nothing else.
 */
export function qrSvg(text: string): Promise<string> {
  return renderQr(text, { type: 'svg', errorCorrectionLevel: 'M' });
}
