import { Circle, G, Path, Svg, Text } from '@react-pdf/renderer';
import { boltPosition } from '@/features/bolt-circle/geometry';
import { ACCENT, INK, MUTED, RULE } from './styles';

const R = 80;

/**
 * The wheel's bolt circle as the technician saw it: the valve notch at 12 o'clock, bolt 1 the
 * first bolt clockwise past it, and beside each bolt its place in the tightening sequence.
 */
export function BoltCircleDrawing({ count, sequence }: { count: number; sequence: number[] }) {
  const place = new Map(sequence.map((bolt, i) => [bolt, i + 1]));
  const dot = count > 32 ? 2.2 : 3.2;
  const font = count > 32 ? 5 : count > 20 ? 6 : 7;
  return (
    <Svg width={150} height={150} viewBox="-110 -110 220 220">
      <Circle cx={0} cy={0} r={R} fill="none" stroke={MUTED} strokeWidth={2} />
      <Circle cx={0} cy={0} r={R - 24} fill="none" stroke={RULE} strokeWidth={1} />
      {/* The valve notch: a marker on the ring at 12 o'clock. */}
      <Path d={`M -6 ${-R - 10} L 0 ${-R + 2} L 6 ${-R - 10} Z`} fill={ACCENT} stroke={INK} />
      <Text x={-13} y={-R - 14} style={{ fontSize: 7 }}>
        VALVE
      </Text>
      <G>
        {Array.from({ length: count }, (_, i) => {
          const bolt = i + 1;
          const at = boltPosition(bolt, count, R);
          const label = boltPosition(bolt, count, R + 13);
          const inner = boltPosition(bolt, count, R - 13);
          return (
            <G key={bolt}>
              <Circle cx={at.x} cy={at.y} r={dot} fill={bolt === 1 ? ACCENT : INK} />
              <Text x={label.x - font * 0.55} y={label.y + font * 0.35} style={{ fontSize: font }}>
                {String(bolt)}
              </Text>
              {place.has(bolt) ? (
                <Text
                  x={inner.x - font * 0.55}
                  y={inner.y + font * 0.35}
                  style={{ fontSize: font - 1, fill: ACCENT }}
                >
                  {String(place.get(bolt))}
                </Text>
              ) : null}
            </G>
          );
        })}
      </G>
    </Svg>
  );
}
