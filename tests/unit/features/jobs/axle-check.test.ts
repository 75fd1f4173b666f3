import { describe, expect, it } from 'vitest';
import { axleWarnings, tireSizeErrors } from '@/features/jobs/axle-check';

const four = (lf: string, rf: string, lr: string, rr: string) => [
  { position: 'LF', tireSize: lf },
  { position: 'RF', tireSize: rf },
  { position: 'LR', tireSize: lr },
  { position: 'RR', tireSize: rr },
];

describe('axleWarnings', () => {
  it('four matching tires: no warning', () => {
    expect(axleWarnings(four('30x10R14', '30x10R14', '30x10R14', '30x10R14'))).toEqual([]);
  });
  it('different sizes on the front axle', () => {
    expect(axleWarnings(four('30x10R14', '32x10R14', '30x10R14', '30x10R14'))[0]).toMatch(
      /^Front axle: 30x10R14 and 32x10R14 differ by 6.7 % in diameter/,
    );
  });
  it('radial beside bias on the rear axle', () => {
    expect(axleWarnings(four('30x10R14', '30x10R14', '30x10R14', '30x10-14'))[0]).toMatch(
      /^Rear axle: .* differ in construction/,
    );
  });
  it('axles matched but front and rear differ by more than 1/4 in of circumference (common practice, no source)', () => {
    const w = axleWarnings(four('30x10R14', '30x10R14', '31x10R14', '31x10R14'));
    expect(w).toHaveLength(1);
    expect(w[0]).toMatch(/3\.14 in of circumference, more than 0.25 in/);
  });
  it('a spare is not part of an axle', () => {
    expect(
      axleWarnings([
        ...four('30x10R14', '30x10R14', '30x10R14', '30x10R14'),
        { position: 'spare', tireSize: '27x9-14' },
      ]),
    ).toEqual([]);
  });
  it('unreadable tire sizes are errors at their wheel, not warnings', () => {
    const wheels = four('30x10R14', 'thirty', '30x10R14', '30x10R14');
    expect(axleWarnings(wheels)).toEqual([]);
    expect(Object.keys(tireSizeErrors(wheels))).toEqual(['wheels.1.tireSize']);
  });
});
