import { describe, expect, it } from 'vitest';
import {
  isNearEnough,
  isRecentEnough,
  verificationFor,
  type RecordedVerification,
  type VerificationPolicy,
} from '@/features/torque-plan';

const sameDay25: VerificationPolicy = { recency: 'same_day', days: 1, nearPercent: 25 };
const denver = 'America/Denver';
const at = (iso: string) => ({ timeZone: denver, now: new Date(iso) });
const check = (over: Partial<RecordedVerification> = {}): RecordedVerification => ({
  wrenchId: 'w1',
  recordedAt: '2026-02-10T15:00:00Z',
  referenceValue: 60,
  unit: 'lbf-ft',
  ...over,
});

describe('verification policy: near the working point', () => {
  const sixty = { value: 60, unit: 'lbf-ft' } as const;

  it('exactly ±25 % of the setting counts; just outside does not', () => {
    expect(isNearEnough({ referenceValue: 75, unit: 'lbf-ft' }, sixty, 25)).toBe(true);
    expect(isNearEnough({ referenceValue: 45, unit: 'lbf-ft' }, sixty, 25)).toBe(true);
    expect(isNearEnough({ referenceValue: 75.01, unit: 'lbf-ft' }, sixty, 25)).toBe(false);
    expect(isNearEnough({ referenceValue: 44.99, unit: 'lbf-ft' }, sixty, 25)).toBe(false);
  });

  it("compares in the setting's unit: 900 in-lb is 75 ft-lb (12 in-lb to the ft-lb, exact by definition)", () => {
    expect(isNearEnough({ referenceValue: 900, unit: 'lbf-in' }, sixty, 25)).toBe(true);
    expect(isNearEnough({ referenceValue: 901, unit: 'lbf-in' }, sixty, 25)).toBe(false);
  });

  it('a wrench verified at 10 ft-lb does not count for a 60 ft-lb pass under the 25 % rule, and the reason says where to check', () => {
    const verdict = verificationFor(
      'w1',
      sixty,
      [check({ referenceValue: 10 })],
      sameDay25,
      at('2026-02-10T18:00:00Z'),
    );
    expect(verdict).toEqual({
      counts: false,
      reason: expect.stringMatching(
        /Verified today at 10 ft-lb.*±25 % of the 60 ft-lb setting \(45 ft-lb to 75 ft-lb\)/,
      ),
    });
  });

  it('0 % means any point of the scale counts', () => {
    expect(
      verificationFor(
        'w1',
        sixty,
        [check({ referenceValue: 10 })],
        { ...sameDay25, nearPercent: 0 },
        at('2026-02-10T18:00:00Z'),
      ).counts,
    ).toBe(true);
  });

  it("another wrench's verification, or a failed one, never counts", () => {
    const clock = at('2026-02-10T18:00:00Z');
    expect(verificationFor('w1', sixty, [check({ wrenchId: 'w2' })], sameDay25, clock)).toEqual({
      counts: false,
      reason: 'No passing verification today.',
    });
    expect(
      verificationFor('w1', sixty, [check({ withinTolerance: false })], sameDay25, clock).counts,
    ).toBe(false);
  });
});

describe('verification policy: recency on the shop calendar', () => {
  // Denver is UTC−7 in winter (MST) and UTC−6 from 8 March 2026 (MDT), IANA tz database.
  it("same_day: the shop's day, not UTC's — 23:59 and 00:01 at the shop are different days", () => {
    const lateEvening = '2026-02-10T06:59:00Z'; // 23:59 on 9 Feb in Denver
    const justAfterMidnight = '2026-02-10T07:01:00Z'; // 00:01 on 10 Feb in Denver
    const clock = at('2026-02-10T16:00:00Z'); // 09:00 on 10 Feb in Denver
    expect(isRecentEnough(lateEvening, sameDay25, clock)).toBe(false);
    expect(isRecentEnough(justAfterMidnight, sameDay25, clock)).toBe(true);
    // Both instants are 10 Feb in UTC: a UTC "today" would accept the evening check too.
    expect(
      isRecentEnough(lateEvening, sameDay25, {
        timeZone: 'UTC',
        now: new Date('2026-02-10T16:00:00Z'),
      }),
    ).toBe(true);
  });

  it("same_day late in the shop's evening: a check at 08:00 still counts at 23:30 (past UTC midnight)", () => {
    // 08:00 on 10 Feb in Denver is 15:00Z; 23:30 on 10 Feb is 06:30Z on 11 Feb.
    expect(isRecentEnough('2026-02-10T15:00:00Z', sameDay25, at('2026-02-11T06:30:00Z'))).toBe(
      true,
    );
    expect(isRecentEnough('2026-02-10T15:00:00Z', sameDay25, at('2026-02-11T07:30:00Z'))).toBe(
      false,
    ); // 00:30 on 11 Feb
  });

  it('within_days N: today and the N−1 shop days before (1 = today only)', () => {
    const now = at('2026-02-12T16:00:00Z'); // 09:00 on 12 Feb in Denver
    const withinDays = (days: number): VerificationPolicy => ({
      recency: 'within_days',
      days,
      nearPercent: 25,
    });
    const onTenth = '2026-02-10T07:01:00Z'; // 00:01 on 10 Feb
    const onNinth = '2026-02-10T06:59:00Z'; // 23:59 on 9 Feb
    expect(isRecentEnough('2026-02-12T15:00:00Z', withinDays(1), now)).toBe(true);
    expect(isRecentEnough(onTenth, withinDays(1), now)).toBe(false);
    expect(isRecentEnough(onTenth, withinDays(2), now)).toBe(false);
    expect(isRecentEnough(onTenth, withinDays(3), now)).toBe(true);
    expect(isRecentEnough(onNinth, withinDays(3), now)).toBe(false);
    expect(isRecentEnough(onNinth, withinDays(4), now)).toBe(true);
  });

  it('counts shop days, not 24-hour spans, across the spring-forward night (8 March 2026 in Denver)', () => {
    const now = at('2026-03-09T06:30:00Z'); // 00:30 MDT on 9 March
    const lateOnSeventh = '2026-03-08T06:30:00Z'; // 23:30 MST on 7 March: 23 hours earlier, two shop days back
    const earlyOnEighth = '2026-03-08T07:30:00Z'; // 00:30 MST on 8 March
    const twoDays: VerificationPolicy = { recency: 'within_days', days: 2, nearPercent: 25 };
    expect(isRecentEnough(lateOnSeventh, twoDays, now)).toBe(false);
    expect(isRecentEnough(earlyOnEighth, twoDays, now)).toBe(true);
    expect(isRecentEnough(earlyOnEighth, sameDay25, now)).toBe(false);
  });

  it('the message names the recency the shop chose', () => {
    const v = verificationFor(
      'w1',
      { value: 60, unit: 'lbf-ft' },
      [],
      { recency: 'within_days', days: 7, nearPercent: 25 },
      at('2026-02-12T16:00:00Z'),
    );
    expect(v).toEqual({ counts: false, reason: 'No passing verification in the last 7 days.' });
  });
});
