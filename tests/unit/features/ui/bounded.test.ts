import { describe, expect, it } from 'vitest';
import {
  boundedInt,
  cleanString,
  dateTime,
  isoDate,
  isoDateTime,
  isRealIsoDate,
  PG_INTEGER,
  searchText,
} from '@/features/ui/bounded';
import { integerField, numberField, text } from '@/features/ui/form-data';

const messages = (r: { success: boolean; error?: { issues: { message: string }[] } }) =>
  r.error?.issues.map((i) => i.message) ?? [];

describe('bounded strings', () => {
  it('refuse a NUL byte and other control characters, naming the field', () => {
    for (const bad of [
      'Wren\u0000',
      '\u0007bell',
      'esc\u001b[31m',
      'del\u007f',
      'lone \ud800 surrogate',
    ]) {
      expect(messages(cleanString("the customer's name", 120).safeParse(bad))).toEqual([
        "The customer's name contains a control character (such as a NUL byte); remove it.",
      ]);
    }
  });
  it('keep tab, line breaks (a textarea sends CRLF), accents and emoji', () => {
    expect(text('the notes', 100).parse('line one\r\nline\ttwo')).toBe('line one\r\nline\ttwo');
    expect(text('the notes', 100).parse('Gaëlle 🛞')).toBe('Gaëlle 🛞');
  });
  it('are length-capped', () => {
    expect(messages(text('the notes', 5).safeParse('123456'))).toEqual([
      'Keep the notes under 5 characters.',
    ]);
  });
  it('an empty search box is no filter; a NUL in it is refused', () => {
    expect(searchText().parse('  ')).toBeUndefined();
    expect(searchText().safeParse('a\u0000').success).toBe(false);
  });
});

describe('bounded numbers', () => {
  it("integers stay inside PostgreSQL's integer (PostgreSQL docs, Numeric Types: -2147483648 to +2147483647)", () => {
    expect(boundedInt('the count').parse(PG_INTEGER.max)).toBe(2_147_483_647);
    expect(boundedInt('the count').parse(PG_INTEGER.min)).toBe(-2_147_483_648);
    expect(messages(boundedInt('the count').safeParse(3e9))).toEqual([
      'The count must be at most 2147483647.',
    ]);
    expect(
      messages(integerField('the cycle count', { min: 0, max: 100_000_000 }).safeParse('3e9')),
    ).toEqual(['The cycle count must be at most 100000000.']);
  });
  it('refuse NaN, Infinity and text that is not a number', () => {
    for (const bad of ['NaN', 'Infinity', '1e400', 'twelve', NaN, Infinity])
      expect(numberField('the torque').safeParse(bad).success, String(bad)).toBe(false);
    expect(numberField('the torque').parse('12,5')).toBe(12.5);
  });
});

describe('bounded dates', () => {
  it('a calendar date is a real day in 1900-2200', () => {
    expect(isRealIsoDate('2024-02-29')).toBe(true); // leap year
    for (const bad of [
      '0000-01-01',
      '2023-02-29',
      '2026-02-30',
      '2026-13-01',
      '2026-00-10',
      '1899-12-31',
      '2201-01-01',
      '+275760-09-13',
      '2026-1-1',
    ]) {
      expect(isRealIsoDate(bad), bad).toBe(false);
    }
    expect(messages(isoDate('the calibration due date').safeParse('0000-01-01'))).toEqual([
      'Enter the calibration due date as a real date from 1900 to 2200 (YYYY-MM-DD).',
    ]);
  });
  it("a moment at either end of JavaScript's range is refused, a plausible one kept", () => {
    expect(dateTime('the due date').safeParse(new Date(8.64e15)).success).toBe(false); // the last moment ECMAScript allows (ECMA-262, Time Values)
    expect(dateTime('the due date').safeParse('-271821-04-20T00:00:00Z').success).toBe(false);
    expect(dateTime('the due date').safeParse('not a date').success).toBe(false);
    expect(dateTime('the due date').parse('2026-12-02T10:00:00Z').toISOString()).toBe(
      '2026-12-02T10:00:00.000Z',
    );
    expect(isoDateTime('the time').safeParse('0000-01-01T00:00:00Z').success).toBe(false);
  });
});
