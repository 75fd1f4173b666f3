import { Circle, Path, Svg, Text } from '@react-pdf/renderer';
import { boltPosition } from '@/features/bolt-circle/geometry';
import { digitsPath } from './stroke-digits';
import { ACCENT, INK, MUTED, RULE } from './styles';

const R = 80;

/** A dot as two arcs, so any number of dots go into one path. */
const dotPath = (x: number, y: number, r: number) =>
  `M${x - r} ${y}a${r} ${r} 0 1 0 ${2 * r} 0a${r} ${r} 0 1 0 ${-2 * r} 0Z`;

/**
 * The wheel's bolt circle as the technician saw it: the valve notch at 12 o'clock, bolt 1 the
 * first bolt clockwise past it, and beside each bolt its place in the tightening sequence. Each
 * ring (dots, bolt numbers, places) is one path: the PDF library lays out every SVG element on
 * its own, and a 32-bolt ring drawn element by element cost more than the rest of its page.
 */
export function BoltCircleDrawing({ count, sequence }: { count: number; sequence: number[] }) {
  const place = new Map(sequence.map((bolt, i) => [bolt, i + 1]));
  const dot = count > 32 ? 2.2 : 3.2;
  const font = count > 32 ? 5 : count > 20 ? 6 : 7;
  const height = font * 0.72;
  let dots = '';
  let numbers = '';
  let places = '';
  for (let bolt = 2; bolt <= count; bolt++) {
    const at = boltPosition(bolt, count, R);
    dots += dotPath(at.x, at.y, dot);
  }
  for (let bolt = 1; bolt <= count; bolt++) {
    const label = boltPosition(bolt, count, R + 13);
    numbers += digitsPath(String(bolt), label.x, label.y, height);
    const inner = boltPosition(bolt, count, R - 13);
    const n = place.get(bolt);
    if (n) places += digitsPath(String(n), inner.x, inner.y, height * 0.85);
  }
  const first = boltPosition(1, count, R);
  return (
    <Svg width={150} height={150} viewBox="-110 -110 220 220">
      <Circle cx={0} cy={0} r={R} fill="none" stroke={MUTED} strokeWidth={2} />
      <Circle cx={0} cy={0} r={R - 24} fill="none" stroke={RULE} strokeWidth={1} />
      {/* The valve notch: a marker on the ring at 12 o'clock. */}
      <Path d={`M -6 ${-R - 10} L 0 ${-R + 2} L 6 ${-R - 10} Z`} fill={ACCENT} stroke={INK} />
      <Text x={-13} y={-R - 14} style={{ fontSize: 7 }}>
        VALVE
      </Text>
      <Path d={dots} fill={INK} />
      <Path d={dotPath(first.x, first.y, dot)} fill={ACCENT} />
      <Path
        d={numbers}
        fill="none"
        stroke={INK}
        strokeWidth={height / 7}
        strokeLinecap="round"
        strokeLinejoin="round"
      />
      <Path
        d={places}
        fill="none"
        stroke={ACCENT}
        strokeWidth={height / 8}
        strokeLinecap="round"
        strokeLinejoin="round"
      />
    </Svg>
  );
}
