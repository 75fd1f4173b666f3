import { describe, expect, it } from 'vitest';
import { THREAD_CONDITIONS, threadConditionText } from '@/features/torque-plan';

describe('thread condition', () => {
  it('names each condition a wheel maker may state', () => {
    expect(THREAD_CONDITIONS.map((c) => threadConditionText(c))).toEqual([
      'Dry — clean threads, no lubricant',
      'Oiled — light oil on the threads',
      'Anti-seize on the threads',
      'Thread locker on the threads',
    ]);
  });
  it('tells the technician to check the maker when the spec is silent, never guessing dry', () => {
    expect(threadConditionText(null)).toMatch(/Not stated.*wheel maker/);
    expect(threadConditionText(undefined)).not.toMatch(/^Dry/);
  });
});
