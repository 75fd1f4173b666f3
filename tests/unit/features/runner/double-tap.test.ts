import { describe, expect, it } from 'vitest';
import { DOUBLE_TAP_MS, tapCounts } from '@/features/runner/double-tap';

describe('the double-tap guard', () => {
  it('takes the first tap', () => {
    expect(tapCounts(null, 1_000)).toBe(true);
  });
  it('ignores a second tap within 400 ms of a confirmation', () => {
    expect(DOUBLE_TAP_MS).toBe(400);
    expect(tapCounts(1_000, 1_001)).toBe(false);
    expect(tapCounts(1_000, 1_399)).toBe(false);
  });
  it('takes a tap 400 ms or more later', () => {
    expect(tapCounts(1_000, 1_400)).toBe(true);
    expect(tapCounts(1_000, 5_000)).toBe(true);
  });
  it('never blocks when the clock went backwards', () => {
    expect(tapCounts(5_000, 1_000)).toBe(true);
  });
});
