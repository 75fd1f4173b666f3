import { z } from 'zod';
import { PRESSURE_UNITS, THREAD_CONDITIONS, TORQUE_UNITS } from '@/features/torque-plan';
import {
  checkbox,
  integerField,
  optional,
  positiveNumber,
  requiredText,
  text,
} from '@/features/ui/form-data';

export const PATTERN_VALUES = ['cross', 'skip', 'sequential'] as const;

const torqueUnit = z.enum(TORQUE_UNITS, { error: 'Choose ft-lb, in-lb or N·m.' });
const pressureUnit = z.enum(PRESSURE_UNITS, { error: 'Choose psi, kPa or bar.' });

/** "30, 70, 100" (a form) or [30, 70, 100] (JSON): the passes as percent of the final torque. */
const passPercents = z.preprocess(
  (v) =>
    typeof v === 'string'
      ? v
          .split(/[,;\s]+/)
          .filter(Boolean)
          .map((p) => Number(p.replace('%', '')))
      : v,
  z
    .array(
      z
        .number({ error: 'Write the passes as percentages, like 30, 70, 100.' })
        .refine(Number.isFinite, { error: 'Write the passes as percentages, like 30, 70, 100.' }),
      {
        error: 'Write the passes as percentages, like 30, 70, 100.',
      },
    )
    .min(1, { error: 'Give at least one pass, ending at 100.' })
    .max(8, { error: 'At most 8 passes.' }),
);

export const specSchema = z
  .object({
    name: requiredText('a name for the spec', 80),
    boltCount: integerField('the bolt count'),
    boltThread: requiredText('the ring bolt thread (e.g. M8×1.25 or 5/16-18)', 40),
    finalTorque: positiveNumber('the final torque'),
    torqueUnit,
    passPercents,
    patternKind: z.enum(PATTERN_VALUES, { error: 'Choose cross, skip or sequential.' }),
    skipStep: optional(integerField('the skip step')),
    checkPass: checkbox,
    lugTorque: optional(positiveNumber('the lug-nut torque')),
    lugTorqueUnit: optional(torqueUnit),
    lugCount: optional(
      integerField('the lug count').pipe(
        z
          .number()
          .min(3, { error: 'A wheel has at least 3 lug nuts.' })
          .max(12, { error: 'At most 12 lug nuts.' }),
      ),
    ),
    maxBeadSeatPressure: positiveNumber("the tire's maximum bead-seating pressure"),
    runningPressure: positiveNumber('the running pressure'),
    pressureUnit,
    makerReference: text("the maker's reference", 300).default(''),
    /** The tire maker's published higher bead-seat rating (document and page), for a limit above 40 psi. */
    beadSeatRatingReference: text("the tire maker's rating reference", 300).default(''),
    /** Ticked by a lead who checked that rating; only a lead may tick it. */
    beadSeatRatingConfirmed: checkbox.default(false),
    notes: text('the notes', 2000).default(''),
    threadCondition: optional(
      z.enum(THREAD_CONDITIONS, {
        error: 'Choose dry, oiled, anti-seize or thread locker, as the wheel maker says.',
      }),
    ),
    boltReuse: text('the bolt reuse rule', 300).default(''),
  })
  .superRefine((s, ctx) => {
    if (s.patternKind === 'skip' && s.skipStep === undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['skipStep'],
        message: 'A skip pattern needs its step (tighten every k-th bolt).',
      });
    }
    if (s.lugTorque !== undefined && !s.lugTorqueUnit) {
      ctx.addIssue({
        code: 'custom',
        path: ['lugTorqueUnit'],
        message: 'Choose the unit of the lug-nut torque.',
      });
    }
  });

export type SpecInput = z.infer<typeof specSchema>;
export const specIdField = z.uuid({ error: 'Unknown spec.' });
