import { describe, expect, it } from 'vitest';
import { recheckDueOn, reminderKey, reminderSendsAt } from '@/features/follow-up/recheck-due';

// Zone offsets and change dates from the IANA time zone database as Node's Intl ships it:
// Denver is UTC−7 (MST) and UTC−6 (MDT); in 2026 the clocks go forward on 8 March and back on
// 1 November, at 02:00 local time.
describe('the re-check due day, on the shop’s calendar', () => {
  it('counts from the shop’s day of sign-off, not the UTC date', () => {
    // 22:30 on 1 December in Denver is already 05:30 on 2 December in UTC.
    const lateEvening = new Date('2026-12-02T05:30:00Z');
    expect(recheckDueOn(lateEvening, 'America/Denver', 7)).toBe('2026-12-08');
    expect(recheckDueOn(lateEvening, 'UTC', 7)).toBe('2026-12-09');
  });

  it('crosses a month and a year end, and zero days means the same day', () => {
    expect(recheckDueOn(new Date('2026-12-28T18:00:00Z'), 'America/Denver', 7)).toBe('2027-01-04');
    expect(recheckDueOn(new Date('2028-02-25T18:00:00Z'), 'America/Denver', 4)).toBe('2028-02-29');
    expect(recheckDueOn(new Date('2026-06-01T18:00:00Z'), 'America/Denver', 0)).toBe('2026-06-01');
  });

  it('sends at 09:00 shop time whichever side of a clock change the day falls', () => {
    expect(reminderSendsAt('2026-03-07', 'America/Denver').toISOString()).toBe(
      '2026-03-07T16:00:00.000Z', // MST
    );
    expect(reminderSendsAt('2026-03-08', 'America/Denver').toISOString()).toBe(
      '2026-03-08T15:00:00.000Z', // the spring-forward day itself: already MDT at 09:00
    );
    expect(reminderSendsAt('2026-11-01', 'America/Denver').toISOString()).toBe(
      '2026-11-01T16:00:00.000Z', // the fall-back day: MST again by 09:00
    );
    expect(reminderSendsAt('2026-07-01', 'Pacific/Auckland').toISOString()).toBe(
      '2026-06-30T21:00:00.000Z', // NZST, UTC+12: the day before in UTC
    );
  });

  it('keys one waiting reminder per job card and day', () => {
    expect(reminderKey('j1', '2026-12-08')).toBe('j1:2026-12-08');
    expect(reminderKey('j1', '2026-12-08')).not.toBe(reminderKey('j1', '2026-12-09'));
  });

  it('refuses something that is not a day', () => {
    expect(() => reminderSendsAt('2026-02-30', 'UTC')).toThrow(/Not a calendar day/);
  });
});
