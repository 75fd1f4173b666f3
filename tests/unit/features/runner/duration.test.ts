import { describe, expect, it } from 'vitest';
import { formatDuration } from '@/features/runner/duration';

describe('formatDuration', () => {
  it('reads in seconds, minutes and hours', () => {
    expect(formatDuration(0)).toBe('0 s');
    expect(formatDuration(44_600)).toBe('45 s');
    expect(formatDuration(60_000)).toBe('1 min');
    expect(formatDuration(200_000)).toBe('3 min 20 s');
    expect(formatDuration(3_900_000)).toBe('1 h 5 min');
    expect(formatDuration(7_200_000)).toBe('2 h');
    expect(formatDuration(-5)).toBe('0 s'); // device clocks that disagree never show a negative time
  });
});
