import { describe, expect, it } from 'vitest';
import {
  ACCOUNT_DELAY_CAP_MS,
  ACCOUNT_FREE_FAILURES,
  accountDelayMs,
} from '@/server/auth/throttle';

describe('accountDelayMs (how an account under attack from many addresses is slowed)', () => {
  it('costs nothing for the first few failures, then doubles, and never exceeds the cap', () => {
    expect(accountDelayMs(0)).toBe(0);
    expect(accountDelayMs(ACCOUNT_FREE_FAILURES - 1)).toBe(0);
    expect(accountDelayMs(ACCOUNT_FREE_FAILURES + 1)).toBe(
      2 * accountDelayMs(ACCOUNT_FREE_FAILURES),
    );
    expect(accountDelayMs(1_000)).toBe(ACCOUNT_DELAY_CAP_MS);
    for (let n = 0; n < 100; n++)
      expect(accountDelayMs(n + 1)).toBeGreaterThanOrEqual(accountDelayMs(n));
  });
});
