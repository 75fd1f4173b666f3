import { z } from 'zod';

/**
 * The bounds every value from outside passes before it reaches the database, in one place: a
 * value PostgreSQL cannot store (a NUL byte, an integer beyond its `integer`, the year 0000) is
 * refused here with a message naming the field, instead of failing deep inside as our error.
 */

/** PostgreSQL's `integer` (int4): −2 147 483 648 … 2 147 483 647 (PostgreSQL docs, "Numeric Types"). */
export const PG_INTEGER = { min: -2_147_483_648, max: 2_147_483_647 } as const;

/** Years a shop's dates can plausibly fall in; well inside JavaScript's and PostgreSQL's ranges. */
export const YEARS = { min: 1900, max: 2200 } as const;

/** Plain measured quantities (torques, pressures, readings): far above any real one, far below overflow. */
export const QUANTITY_MAX = 1_000_000;

// C0 controls except tab, line feed and carriage return (a textarea sends CRLF), DEL, and lone
// UTF-16 surrogates (PostgreSQL's jsonb refuses "\ud800"). With the u flag a valid pair is one
// code point, so emoji pass.
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]|\p{Cs}/u;

export const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

export const hasControlCharacters = (s: string) => CONTROL.test(s);

/** A string of at most `max` characters with no control characters (trimmed). */
export const cleanString = (label: string, max: number) =>
  z
    .string({ error: `Enter ${label}.` })
    .trim()
    .max(max, { error: `Keep ${label} under ${max} characters.` })
    .refine((s) => !CONTROL.test(s), {
      error: `${capitalise(label)} contains a control character (such as a NUL byte); remove it.`,
    });

/** A search box's text: the same rules, and an empty box means no filter. */
export const searchText = (label = 'the search', max = 100) =>
  z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? undefined : v),
    cleanString(label, max).optional(),
  );

/** A finite number in [min, max]. */
export const boundedNumber = (label: string, range: { min: number; max: number }) =>
  z
    .number({ error: `Enter ${label} as a number.` })
    .refine(Number.isFinite, { error: `Enter ${label} as a number.` })
    .refine((n) => n >= range.min, { error: `${capitalise(label)} must be at least ${range.min}.` })
    .refine((n) => n <= range.max, { error: `${capitalise(label)} must be at most ${range.max}.` });

/** A whole number in [min, max], never beyond PostgreSQL's `integer`. */
export const boundedInt = (label: string, range: { min: number; max: number } = PG_INTEGER) =>
  boundedNumber(label, {
    min: Math.max(range.min, PG_INTEGER.min),
    max: Math.min(range.max, PG_INTEGER.max),
  }).refine(Number.isInteger, {
    error: `${capitalise(label)} must be a whole number.`,
  });

/** Query-string integers (page numbers): digits only, within the range. */
export const queryInt = (label: string, range: { min: number; max: number }, fallback: number) =>
  z.preprocess(
    (v) =>
      v === undefined || v === ''
        ? fallback
        : typeof v === 'string' && /^\d{1,10}$/.test(v.trim())
          ? Number(v)
          : v,
    boundedInt(label, range),
  );

const yearOk = (year: number) => year >= YEARS.min && year <= YEARS.max;

/** A real calendar day (no Feb 30, no month 13) written YYYY-MM-DD, in the plausible years. */
export function isRealIsoDate(s: string): boolean {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(s);
  if (!m) return false;
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  if (!yearOk(year) || month < 1 || month > 12 || day < 1) return false;
  return day <= new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** A calendar date as the string YYYY-MM-DD (what a `date` column takes). */
export const isoDate = (label: string) =>
  z
    .string({ error: `Enter ${label} (YYYY-MM-DD).` })
    .trim()
    .max(10, { error: `Enter ${label} (YYYY-MM-DD).` })
    .refine(isRealIsoDate, {
      error: `Enter ${label} as a real date from ${YEARS.min} to ${YEARS.max} (YYYY-MM-DD).`,
    });

const dateInYears = (d: Date) => !Number.isNaN(d.getTime()) && yearOk(d.getUTCFullYear());

/** A moment (a form's date-time, an ISO string or a Date), in the plausible years. */
export const dateTime = (label: string) =>
  z
    .preprocess(
      (v) => (typeof v === 'string' && v.length > 40 ? 'invalid' : v),
      z.coerce.date({ error: `Enter ${label}.` }),
    )
    .refine(dateInYears, { error: `Enter ${label} from ${YEARS.min} to ${YEARS.max}.` });

/** An ISO 8601 UTC timestamp string (what a device sends), in the plausible years. */
export const isoDateTime = (label: string) =>
  z.iso
    .datetime({ error: `Enter ${label} as an ISO time.` })
    .refine((s) => dateInYears(new Date(s)), {
      error: `${capitalise(label)} must be from ${YEARS.min} to ${YEARS.max}.`,
    });
