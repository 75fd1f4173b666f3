import { z } from 'zod';

// Form fields arrive as strings; these turn them into what the schemas mean, with our messages.
// They also accept the real types, so the same schema validates JSON bodies.

const blankToUndefined = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v);

export const numberField = (label: string) =>
  z.preprocess(
    (v) => {
      const b = blankToUndefined(v);
      return typeof b === 'string' ? Number(b.replace(',', '.')) : b;
    },
    z.number({ error: `Enter ${label} as a number.` }).refine(Number.isFinite, { error: `Enter ${label} as a number.` }),
  );

export const positiveNumber = (label: string) => numberField(label).pipe(z.number().positive({ error: `${capitalise(label)} must be greater than zero.` }));

export const integerField = (label: string) => numberField(label).pipe(z.number().int({ error: `${capitalise(label)} must be a whole number.` }));

export const optional = <T extends z.ZodType>(schema: T) => z.preprocess(blankToUndefined, schema.optional());

export const checkbox = z.preprocess((v) => v === true || v === 'on' || v === 'true' || v === '1', z.boolean());

export const text = (label: string, max = 200) =>
  z.string({ error: `Enter ${label}.` }).trim().max(max, { error: `Keep ${label} under ${max} characters.` });

export const requiredText = (label: string, max = 200) => text(label, max).min(1, { error: `Enter ${label}.` });

function capitalise(s: string) {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
