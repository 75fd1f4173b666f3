import { describe, expect, it } from 'vitest';
import { intakeWarnings } from '@/features/jobs/axle-check';

const wheels = (...positions: string[]) => positions.map((position) => ({ position }));

// Both tires of an axle are replaced together (common practice, no source).
describe('intakeWarnings: one wheel of an axle', () => {
  it('LF without RF warns for the front axle, naming both', () => {
    expect(intakeWarnings(wheels('LF'))).toEqual([
      expect.stringMatching(/^Front axle: only LF is on this job card, not RF\..*differential/),
    ]);
  });

  it('RR without LR warns for the rear axle', () => {
    expect(intakeWarnings(wheels('LF', 'RF', 'RR'))).toEqual([
      expect.stringMatching(/^Rear axle: only RR .* not LR/),
    ]);
  });

  it('whole axles, all four, or a spare alone: no warning', () => {
    expect(intakeWarnings(wheels('LF', 'RF'))).toEqual([]);
    expect(intakeWarnings(wheels('LF', 'RF', 'LR', 'RR', 'spare'))).toEqual([]);
    expect(intakeWarnings(wheels('spare'))).toEqual([]);
  });

  it('one wheel on each axle warns twice', () => {
    expect(intakeWarnings(wheels('LF', 'LR'))).toHaveLength(2);
  });
});
