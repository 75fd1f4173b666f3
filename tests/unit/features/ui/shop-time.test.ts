import { describe, expect, it } from 'vitest';
import {
  addDays,
  dayStatus,
  dueStatus,
  dueWindows,
  formatShopDay,
  formatShopTime,
  formatShopTimeForMail,
  fromShopLocal,
  shopDay,
  startOfShopDay,
  toShopLocal,
  zoneLabel,
} from '@/features/ui/shop-time';

// DST dates used below:
// - America/Denver: US Energy Policy Act of 2005 rule, clocks go forward on the second Sunday of
//   March (2026-03-08, 02:00 MST → 03:00 MDT) and back on the first Sunday of November
//   (2026-11-01, 02:00 MDT → 01:00 MST).
// - Europe/Berlin: EU Directive 2000/84/EC, summer time from 01:00 UTC on the last Sunday of
//   March (2026-03-29, 02:00 CET → 03:00 CEST) to 01:00 UTC on the last Sunday of October (2026-10-25).
const DENVER = 'America/Denver';
const BERLIN = 'Europe/Berlin';

describe('formatting on the shop clock', () => {
  const instant = '2026-07-04T18:05:00Z';

  it('shows the same instant as each shop reads it on its wall clock', () => {
    expect(formatShopTime(instant, 'UTC')).toBe('Jul 4, 2026, 6:05 PM');
    expect(formatShopTime(instant, DENVER)).toBe('Jul 4, 2026, 12:05 PM'); // MDT, UTC−6
    expect(formatShopTime(instant, BERLIN)).toBe('Jul 4, 2026, 8:05 PM'); // CEST, UTC+2
    expect(formatShopTime(instant, 'Asia/Kolkata')).toBe('Jul 4, 2026, 11:35 PM'); // IST, UTC+5:30
    expect(formatShopTime(instant, 'Pacific/Auckland', 'date')).toBe('Jul 5, 2026'); // already tomorrow
    expect(formatShopTime(instant, DENVER, 'time')).toBe('12:05 PM');
  });

  it('never prints a zone name or "UTC" on a screen, and uses plain spaces (the same text on server and phone)', () => {
    for (const zone of ['UTC', 'Etc/UTC', DENVER, BERLIN]) {
      const text = formatShopTime(instant, zone);
      expect(text).not.toMatch(/UTC|GMT|MDT|CEST/);
      expect(text).not.toMatch(/[\u202f\u00a0]/);
    }
    expect(zoneLabel('UTC')).toBe('Coordinated Universal Time');
    expect(zoneLabel('America/Argentina/Buenos_Aires')).toBe('America/Argentina/Buenos Aires');
  });

  it('spells the zone out in an e-mail, read away from the shop', () => {
    expect(formatShopTimeForMail(new Date('2026-12-09T06:30:00Z'), DENVER)).toBe(
      'December 8, 2026 at 11:30 PM Mountain Standard Time',
    );
    expect(formatShopTimeForMail(new Date('2026-12-09T06:30:00Z'), 'UTC')).not.toContain('UTC');
  });

  it('shows a calendar date (no instant behind it) as the same day everywhere', () => {
    expect(formatShopDay('2026-03-08')).toBe('Mar 8, 2026');
  });
});

describe("the shop's calendar day", () => {
  it('23:30 in Denver is still that day at the shop though UTC is already on the next', () => {
    const late = new Date('2026-12-02T06:30:00Z'); // 23:30 MST on 1 December
    expect(shopDay(late, DENVER)).toBe('2026-12-01');
    expect(shopDay(late, 'UTC')).toBe('2026-12-02');
    expect(shopDay(new Date('2026-12-02T07:00:00Z'), DENVER)).toBe('2026-12-02'); // the shop's midnight
  });

  it('a day across the spring change is 23 hours, across the autumn change 25', () => {
    expect(startOfShopDay('2026-03-08', DENVER).toISOString()).toBe('2026-03-08T07:00:00.000Z');
    expect(startOfShopDay('2026-03-09', DENVER).toISOString()).toBe('2026-03-09T06:00:00.000Z');
    expect(
      startOfShopDay('2026-11-02', DENVER).getTime() -
        startOfShopDay('2026-11-01', DENVER).getTime(),
    ).toBe(25 * 3_600_000);
    expect(
      startOfShopDay('2026-03-30', BERLIN).getTime() -
        startOfShopDay('2026-03-29', BERLIN).getTime(),
    ).toBe(23 * 3_600_000);
  });

  it('counts days on the calendar, across month and year ends', () => {
    expect(addDays('2026-02-28', 1)).toBe('2026-03-01');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2026-03-01', -1)).toBe('2026-02-28');
  });

  it('"due today" and "overdue" follow the shop clock around its midnight', () => {
    const now = new Date('2026-12-02T06:30:00Z'); // 23:30 at a Denver shop
    const clock = { timeZone: DENVER, now };
    expect(dueStatus('2026-12-02T06:45:00Z', clock)).toBe('today'); // 23:45 the same shop day
    expect(dueStatus('2026-12-02T07:15:00Z', clock)).toBe('later'); // 00:15 tomorrow at the shop, though the same UTC date
    expect(dueStatus('2026-12-02T06:00:00Z', clock)).toBe('overdue');
    expect(dueStatus('2026-12-02T07:15:00Z', { timeZone: 'UTC', now })).toBe('today');
    expect(dayStatus('2026-12-01', clock)).toBe('today');
    expect(dayStatus('2026-11-30', clock)).toBe('overdue');
    expect(dayStatus('2026-12-02', clock)).toBe('later');
  });

  it("the board's windows are the shop's whole day, and now to the end of the seventh day after it", () => {
    const w = dueWindows({ timeZone: DENVER, now: new Date('2026-03-07T20:00:00Z') }); // 13:00 MST, the day before the change
    expect(w.today.from.toISOString()).toBe('2026-03-07T07:00:00.000Z');
    expect(w.today.to.toISOString()).toBe('2026-03-08T07:00:00.000Z');
    expect(w.week.to.toISOString()).toBe('2026-03-15T06:00:00.000Z'); // midnight MDT after the change
  });
});

describe('a due time typed at the shop (datetime-local)', () => {
  it('is read in the shop zone, not the phone’s, and comes back as typed', () => {
    expect(fromShopLocal('2026-12-01T23:30', DENVER)?.toISOString()).toBe(
      '2026-12-02T06:30:00.000Z',
    );
    expect(fromShopLocal('2026-12-01T23:30', BERLIN)?.toISOString()).toBe(
      '2026-12-01T22:30:00.000Z',
    );
    for (const zone of ['UTC', DENVER, BERLIN, 'Asia/Kolkata', 'Australia/Lord_Howe']) {
      for (const typed of ['2026-01-15T08:00', '2026-07-15T16:45', '2026-11-01T00:30']) {
        expect(toShopLocal(fromShopLocal(typed, zone)!, zone)).toBe(typed);
      }
    }
  });

  it('a time in the skipped hour moves on by the gap (02:30 on the spring night is 03:30)', () => {
    const denver = fromShopLocal('2026-03-08T02:30', DENVER)!;
    expect(denver.toISOString()).toBe('2026-03-08T09:30:00.000Z');
    expect(toShopLocal(denver, DENVER)).toBe('2026-03-08T03:30');
    const berlin = fromShopLocal('2026-03-29T02:30', BERLIN)!;
    expect(berlin.toISOString()).toBe('2026-03-29T01:30:00.000Z');
    expect(toShopLocal(berlin, BERLIN)).toBe('2026-03-29T03:30');
  });

  it('a time that happens twice (the autumn night) is the first one', () => {
    expect(fromShopLocal('2026-11-01T01:30', DENVER)?.toISOString()).toBe(
      '2026-11-01T07:30:00.000Z',
    ); // 01:30 MDT
    expect(fromShopLocal('2026-10-25T02:30', BERLIN)?.toISOString()).toBe(
      '2026-10-25T00:30:00.000Z',
    ); // 02:30 CEST
  });

  it('refuses text that is not a date and time', () => {
    expect(fromShopLocal('2026-02-30T10:00', DENVER)).toBeNull();
    expect(fromShopLocal('tomorrow', DENVER)).toBeNull();
    expect(fromShopLocal('2026-03-08T24:00', DENVER)).toBeNull();
  });
});
