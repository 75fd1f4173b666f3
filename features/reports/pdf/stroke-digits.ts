/**
 * Bolt numbers drawn as strokes, so a whole ring of numbers is one SVG path. The PDF library lays
 * out every SVG text element on its own (shaping, bidi, line breaking): 64 numbers per wheel were
 * a fifth of the report's build time. Seven-segment figures read well at drawing size.
 */

type Point = readonly [number, number];
/** Segments on a 4 × 6 grid, y down: top, upper right, lower right, bottom, lower left, upper left, middle. */
const SEGMENTS: Record<string, readonly [Point, Point]> = {
  a: [
    [0, 0],
    [4, 0],
  ],
  b: [
    [4, 0],
    [4, 3],
  ],
  c: [
    [4, 3],
    [4, 6],
  ],
  d: [
    [0, 6],
    [4, 6],
  ],
  e: [
    [0, 3],
    [0, 6],
  ],
  f: [
    [0, 0],
    [0, 3],
  ],
  g: [
    [0, 3],
    [4, 3],
  ],
};
const DIGITS: Record<string, readonly (readonly [Point, Point])[]> = {
  ...Object.fromEntries(
    Object.entries({
      0: 'abcdef',
      2: 'abged',
      3: 'abgcd',
      4: 'fgbc',
      5: 'afgcd',
      6: 'afgedc',
      7: 'abc',
      8: 'abcdefg',
      9: 'abcdfg',
    }).map(([digit, segs]) => [digit, [...segs].map((s) => SEGMENTS[s]!)]),
  ),
  // A one down the middle with a flag, so it is not mistaken for a stray line.
  1: [
    [
      [1, 1],
      [2, 0],
    ],
    [
      [2, 0],
      [2, 6],
    ],
  ],
};
const WIDTH = 4;
const GAP = 2;
const round = (v: number) => Math.round(v * 100) / 100;

/** Path data for `text` (digits only) of cap height `height`, centred on (cx, cy). */
export function digitsPath(text: string, cx: number, cy: number, height: number): string {
  const scale = height / 6;
  const width = (text.length * WIDTH + (text.length - 1) * GAP) * scale;
  const left = cx - width / 2;
  const top = cy - height / 2;
  return [...text]
    .flatMap((ch, i) =>
      (DIGITS[ch] ?? []).map(([[x1, y1], [x2, y2]]) => {
        const x0 = left + i * (WIDTH + GAP) * scale;
        return `M${round(x0 + x1 * scale)} ${round(top + y1 * scale)}L${round(x0 + x2 * scale)} ${round(top + y2 * scale)}`;
      }),
    )
    .join('');
}
