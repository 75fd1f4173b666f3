import { z } from 'zod';
import {
  boundedInt,
  boundedNumber,
  capitalise,
  cleanString,
  PG_INTEGER,
  QUANTITY_MAX,
} from './bounded';

// Form fields arrive as strings; these turn them into what the schemas mean, with our messages.
// They also accept the real types, so the same schema validates JSON bodies.

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

const toNumber = (v: unknown) => {
  const b = blankToUndefined(v);
  return typeof b === 'string' ? Number(b.replace(',', '.')) : b;
};

/** A finite number, by default within ±1 000 000 (a measured quantity); pass a tighter range where the field means less. */
export const numberField = (
  label: string,
  range: { min: number; max: number } = { min: -QUANTITY_MAX, max: QUANTITY_MAX },
) => z.preprocess(toNumber, boundedNumber(label, range));

export const positiveNumber = (label: string) =>
  numberField(label).pipe(
    z.number().positive({ error: `${capitalise(label)} must be greater than zero.` }),
  );

/** A whole number, never beyond PostgreSQL's `integer`; pass a tighter range where the field means less. */
export const integerField = (label: string, range: { min: number; max: number } = PG_INTEGER) =>
  z.preprocess(toNumber, boundedInt(label, range));

export const optional = <T extends z.ZodType>(schema: T) =>
  z.preprocess(blankToUndefined, schema.optional());

export const checkbox = z.preprocess(
  (v) => v === true || v === 'on' || v === 'true' || v === '1',
  z.boolean(),
);

/** Trimmed, at most `max` characters, no control characters (a NUL byte cannot be stored). */
export const text = (label: string, max = 200) => cleanString(label, max);

export const requiredText = (label: string, max = 200) =>
  text(label, max).min(1, { error: `Enter ${label}.` });
