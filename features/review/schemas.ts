import { z } from 'zod';
import { requiredText, text } from '@/features/ui/form-data';

const jobId = z.uuid({ error: 'Unknown job card.' });

/** One blocking anomaly accepted by the lead, by its key, with why it is acceptable. */
export const acknowledgementSchema = z.object({
  key: z.string().min(1).max(400, { error: 'Unknown anomaly.' }),
  reason: text('the reason', 500).min(3, {
    error: 'Say why this is acceptable (a few words at least).',
  }),
});

export const approveSchema = z.object({
  jobId,
  /** The lead's own note; required (and kept on the record) when they worked on the job themselves. */
  note: text('the note', 1000).default(''),
  acknowledgements: z
    .array(acknowledgementSchema, { error: 'Send the acknowledgements as a list.' })
    .max(200)
    .default([]),
});

export const sendBackWheelSchema = z.object({
  wheelId: z.uuid({ error: 'Unknown wheel.' }),
  note: requiredText('what to redo on this wheel', 1000),
  steps: z
    .array(z.string().regex(/^[a-z_]{1,20}$/, { error: 'Unknown step.' }))
    .max(12)
    .default([]),
});

export const sendBackSchema = z.object({
  jobId,
  wheels: z
    .array(sendBackWheelSchema, { error: 'Pick the wheels to send back.' })
    .min(1, { error: 'Pick at least one wheel to send back.' })
    .max(5),
});

export type ApproveInput = z.infer<typeof approveSchema>;
export type SendBackInput = z.infer<typeof sendBackSchema>;
