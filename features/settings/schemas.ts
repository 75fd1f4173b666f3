import { z } from 'zod';
import { PRESSURE_UNITS, TORQUE_UNITS, UNIT_LABELS } from '@/features/torque-plan';
import { knownTimeZone } from '@/features/ui/time-zone-names';

const unitList = (units: readonly (keyof typeof UNIT_LABELS)[]) =>
  units.map((u) => `${u} (${UNIT_LABELS[u]})`).join(', ');

const number = (label: string) =>
  z
    .number({ error: `Enter ${label} as a number.` })
    .refine(Number.isFinite, { error: `Enter ${label} as a number.` });
const wholeDays = (label: string) =>
  number(label)
    .refine(Number.isInteger, { error: `${label} must be a whole number of days.` })
    .refine((n) => n >= 1 && n <= 365, { error: `${label} must be from 1 to 365 days.` });

export const timeZoneField = z
  .string({ error: 'Pick the time zone from the list, e.g. America/Denver.' })
  .trim()
  .transform((name, ctx) => {
    const known = knownTimeZone(name);
    if (!known)
      ctx.addIssue({
        code: 'custom',
        message: `"${name.slice(0, 64)}" is not a time zone: pick one from the list, e.g. America/Denver or UTC.`,
      });
    return known ?? name;
  });

/** Unknown names are refused at their own path, so the 400 names them (a typo must not look saved). */
function refuseUnknown(known: readonly string[], what: string) {
  return (value: Record<string, unknown>, ctx: z.RefinementCtx) => {
    for (const key of Object.keys(value)) {
      if (!known.includes(key))
        ctx.addIssue({
          code: 'custom',
          path: [key],
          message: `Unknown ${what} "${key.slice(0, 40)}": use ${known.join(', ')}.`,
        });
    }
  };
}

const verificationShape = {
  recency: z.enum(['same_day', 'within_days'], {
    error: 'Choose how recent: same_day or within_days.',
  }),
  days: wholeDays('The verification window'),
  nearPercent: number('how near the working point (%)').refine((n) => n >= 0 && n <= 100, {
    error: 'How near the working point must be from 0 to 100 % (0 = any point).',
  }),
};

/** The shop's verification rule; every part optional, so a PATCH may change one. */
const verificationPatch = z
  .looseObject(verificationShape, {
    error: 'Give the verification rule as { recency, days, nearPercent }.',
  })
  .partial()
  .superRefine(refuseUnknown(Object.keys(verificationShape), 'verification setting'));

/**
 * PATCH /api/shop/settings and the Settings page: any subset of the shop's settings. An unknown
 * name is refused (a typo must not look like a saved change).
 */
const settingsShape = {
  timeZone: timeZoneField,
  wrenchFloorPercent: number('the wrench floor (%)').refine((n) => n >= 0 && n < 100, {
    error: "The wrench floor must be from 0 to below 100 % of a wrench's maximum.",
  }),
  verification: verificationPatch,
  // Bounded: a threshold of minutes would flag every bolt and tell the lead nothing.
  tooFastSecondsPerBolt: number('the too-fast threshold (seconds per bolt)').refine(
    (n) => n > 0 && n <= 60,
    { error: 'The too-fast threshold must be above 0 and at most 60 seconds per bolt.' },
  ),
  recheckDays: wholeDays('The re-check'),
  pressureUnit: z.enum(PRESSURE_UNITS, {
    error: `Choose a pressure unit: ${unitList(PRESSURE_UNITS)}.`,
  }),
  torqueUnit: z.enum(TORQUE_UNITS, { error: `Choose a torque unit: ${unitList(TORQUE_UNITS)}.` }),
  singleLeadSelfSignoff: z.boolean({ error: 'Say true or false for the single-lead sign-off.' }),
};

export const settingsPatchSchema = z
  .looseObject(settingsShape, { error: 'Send the settings as a JSON object.' })
  .partial()
  .superRefine(refuseUnknown(Object.keys(settingsShape), 'setting'));

export type SettingsPatch = z.infer<typeof settingsPatchSchema>;

const NUMBER_FIELDS = new Set([
  'wrenchFloorPercent',
  'verification.days',
  'verification.nearPercent',
  'tooFastSecondsPerBolt',
  'recheckDays',
]);

/**
 * The Settings page's form, flat and all strings ("verification.days": "7"), into the PATCH
 * shape. The form sends every field, so an unticked box means false.
 */
function formToPatch(raw: unknown): unknown {
  if (!raw || typeof raw !== 'object') return raw;
  const out: Record<string, unknown> = { singleLeadSelfSignoff: false };
  const verification: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(raw as Record<string, unknown>)) {
    let v: unknown = value;
    if (NUMBER_FIELDS.has(key) && typeof v === 'string')
      v = v.trim() === '' ? undefined : Number(v.trim().replace(',', '.'));
    if (key === 'singleLeadSelfSignoff') v = v === 'on' || v === true;
    if (key.startsWith('verification.')) verification[key.slice('verification.'.length)] = v;
    else out[key] = v;
  }
  if (Object.keys(verification).length) out.verification = verification;
  return out;
}

export const settingsFormSchema = z.preprocess(formToPatch, settingsPatchSchema);
