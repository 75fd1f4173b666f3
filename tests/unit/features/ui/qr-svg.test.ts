import { create } from 'qrcode';
import { describe, expect, it } from 'vitest';
import { qrSvg } from '@/features/ui/qr-svg';

const RUNNER =
  'https://shop.ringpass.test/jobs/7f1c2b9e-0a4d-4c1e-9a3b-2d5e6f708192/wheels/1a2b3c4d-5e6f-4a7b-8c9d-0e1f2a3b4c5d/run';

/** Reads the drawing back: every module the SVG's dark path paints, as a size × size grid. */
function paintedModules(svg: string): { size: number; dark: boolean[] } {
  const total = Number(/viewBox="0 0 (\d+) \d+"/.exec(svg)?.[1]);
  const path = /<path stroke="#000000" d="([^"]+)"/.exec(svg)?.[1];
  if (!total || !path) throw new Error('not a QR drawing');
  const margin = 4;
  const size = total - 2 * margin;
  const dark = new Array<boolean>(size * size).fill(false);
  let x = 0;
  let y = 0;
  // The path uses only M (absolute move), m (relative move) and h (horizontal line) commands.
  for (const [, cmd, a, b] of path.matchAll(/([Mmh])(-?[\d.]+)(?: (-?[\d.]+))?/g)) {
    const n = Number(a);
    if (cmd === 'M') [x, y] = [n, Number(b)];
    else if (cmd === 'm') [x, y] = [x + n, y + Number(b)];
    else {
      for (let col = x; col < x + n; col++)
        dark[(Math.floor(y) - margin) * size + (col - margin)] = true;
      x += n;
    }
  }
  return { size, dark };
}

describe('QR code for a runner link', () => {
  it('draws exactly the symbol that encodes the runner URL, at error correction M, with nothing else in it', async () => {
    const svg = await qrSvg(RUNNER);
    const symbol = create(RUNNER, { errorCorrectionLevel: 'M' });
    const text = symbol.segments
      .map((s) => (typeof s.data === 'string' ? s.data : Buffer.from(s.data).toString('utf8')))
      .join('');
    expect(text).toBe(RUNNER);
    const drawn = paintedModules(svg);
    expect(drawn.size).toBe(symbol.modules.size);
    expect(drawn.dark).toEqual(Array.from(symbol.modules.data, Boolean));
  });

  it('is a self-contained SVG: no script, no link, no image to fetch', async () => {
    const svg = await qrSvg(RUNNER);
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).not.toMatch(/<script|href=|<image|url\(/i);
    expect(svg).not.toContain('shop.ringpass.test');
  });

  it('changes with the wheel: two wheels never share a code', async () => {
    const other = RUNNER.replace('1a2b3c4d', '9a2b3c4d');
    expect(await qrSvg(other)).not.toBe(await qrSvg(RUNNER));
  });
});
