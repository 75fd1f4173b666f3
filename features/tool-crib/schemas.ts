import { z } from 'zod';
import { TORQUE_UNITS } from '@/features/torque-plan';
import { isoDate as boundedIsoDate } from '@/features/ui/bounded';
import {
  integerField,
  optional,
  positiveNumber,
  numberField,
  requiredText,
  text,
} from '@/features/ui/form-data';

export const WRENCH_KINDS = ['click', 'beam', 'dial', 'digital'] as const;
const torqueUnit = z.enum(TORQUE_UNITS, { error: 'Choose ft-lb, in-lb or N·m.' });
const isoDate = boundedIsoDate('the calibration due date');

export const wrenchSchema = z.object({
  label: requiredText('a label (what is written on the wrench or its case)', 60),
  kind: z.enum(WRENCH_KINDS, { error: 'Choose click, beam, dial or digital.' }),
  min: numberField('the lowest mark').pipe(
    z.number().min(0, { error: 'The lowest mark cannot be negative.' }),
  ),
  max: positiveNumber('the highest mark'),
  unit: torqueUnit,
  graduation: positiveNumber('the graduation (smallest step of the scale)'),
  serial: text('the serial number', 60).default(''),
  calibrationDueOn: isoDate,
  cyclesSinceCalibration: optional(integerField('the cycle count', { min: 0, max: 100_000_000 })),
});

export const verificationSchema = z.object({
  referenceValue: positiveNumber('the reference value'),
  readingValue: positiveNumber('the reading'),
  unit: torqueUnit,
});

export const clearSchema = z.object({
  reason: requiredText('why the wrench may go back into service', 300).min(5, {
    error: 'Say why in a few words (at least 5 characters).',
  }),
});

export const wrenchIdField = z.uuid({ error: 'Unknown wrench.' });
export type WrenchInput = z.infer<typeof wrenchSchema>;
export type VerificationInput = z.infer<typeof verificationSchema>;
