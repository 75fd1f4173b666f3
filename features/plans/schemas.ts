import { z } from 'zod';
import { MAX_BOLTS, MIN_BOLTS, TORQUE_UNITS } from '@/features/torque-plan';
import { boundedInt, boundedNumber, cleanString, QUANTITY_MAX } from '@/features/ui/bounded';

const quantity = (label: string) => boundedNumber(label, { min: 0, max: QUANTITY_MAX });

const torqueUnit = z.enum(TORQUE_UNITS, { error: `Use one of: ${TORQUE_UNITS.join(', ')}.` });

const torque = z.object({
  value: quantity('the torque').refine((n) => n > 0, {
    error: 'The torque must be greater than zero.',
  }),
  unit: torqueUnit,
});

export const patternSchema = z.discriminatedUnion(
  'kind',
  [
    z.object({ kind: z.literal('cross') }),
    z.object({
      kind: z.literal('skip'),
      step: boundedInt('the skip step', { min: 1, max: MAX_BOLTS }),
    }),
    z.object({ kind: z.literal('sequential') }),
  ],
  { error: 'The pattern must be cross, skip (with a step) or sequential.' },
);

export const inlineWrenchSchema = z.object({
  id: cleanString('the wrench id', 80).min(1),
  min: quantity('the lowest mark'),
  max: quantity('the highest mark').refine((n) => n > 0, {
    error: 'The highest mark must be greater than zero.',
  }),
  unit: torqueUnit,
  graduation: quantity('the graduation').refine((n) => n > 0, {
    error: 'The graduation must be greater than zero.',
  }),
  kind: z.enum(['click', 'beam', 'dial', 'digital']),
});

export const torquePlanRequestSchema = z
  .object({
    boltCount: z
      .number({ error: 'Give the bolt count as a number.' })
      .int({ error: 'The bolt count must be a whole number.' })
      .min(MIN_BOLTS, { error: `The bolt count must be from ${MIN_BOLTS} to ${MAX_BOLTS}.` })
      .max(MAX_BOLTS, { error: `The bolt count must be from ${MIN_BOLTS} to ${MAX_BOLTS}.` }),
    pattern: patternSchema,
    start: boundedInt('the start bolt', { min: 1, max: MAX_BOLTS }).optional(),
    final: torque,
    fractions: z
      .array(boundedNumber('a pass fraction', { min: 0, max: 10 }))
      .min(1)
      .max(10)
      .optional(),
    checkPass: z.boolean().optional(),
    minFractionOfMax: z.number().min(0).lt(1).optional(),
    wrenchIds: z
      .array(z.uuid({ error: 'Wrench ids are the tool crib ids.' }))
      .max(50)
      .optional(),
    wrenches: z.array(inlineWrenchSchema).max(50).optional(),
  })
  .refine((b) => (b.wrenchIds?.length ?? 0) + (b.wrenches?.length ?? 0) > 0, {
    error: 'Give the wrenches to choose from: wrenchIds from the tool crib, or inline wrenches.',
    path: ['wrenches'],
  });

export type TorquePlanRequest = z.infer<typeof torquePlanRequestSchema>;
