import { describe, expect, it } from 'vitest';
import { digitsPath } from '@/features/reports/pdf/stroke-digits';

const strokes = (d: string) => d.split('M').length - 1;
const points = (d: string) =>
  [...d.matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])] as const);

describe('bolt numbers drawn as strokes on the report', () => {
  it('draws every digit, with the segments a reader expects (8 all seven, 1 a stem and a flag)', () => {
    for (const digit of '0123456789')
      expect(strokes(digitsPath(digit, 0, 0, 6))).toBeGreaterThan(1);
    expect(strokes(digitsPath('8', 0, 0, 6))).toBe(7);
    expect(strokes(digitsPath('1', 0, 0, 6))).toBe(2);
    expect(strokes(digitsPath('7', 0, 0, 6))).toBe(3);
  });

  it('centres a two-digit number on the bolt and keeps it to the given height', () => {
    const xy = points(digitsPath('32', 10, -20, 6));
    const xs = xy.map(([x]) => x);
    const ys = xy.map(([, y]) => y);
    expect(Math.min(...xs) + Math.max(...xs)).toBeCloseTo(20, 1);
    expect(Math.min(...ys)).toBeCloseTo(-23, 5);
    expect(Math.max(...ys)).toBeCloseTo(-17, 5);
  });

  it('draws nothing for characters that are not digits', () => {
    expect(digitsPath('x', 0, 0, 6)).toBe('');
  });
});
