import { z } from 'zod';
import { cleanString } from '@/features/ui/bounded';

/** A lead clears an apprentice for real wheels, with an optional note (what they were seen doing). */
export const clearApprenticeSchema = z.object({
  userId: z.uuid({ error: 'Unknown apprentice.' }),
  note: cleanString('the note', 500).optional().default(''),
});

export const revokeClearanceSchema = z.object({
  userId: z.uuid({ error: 'Unknown apprentice.' }),
});

export type ClearApprenticeInput = z.infer<typeof clearApprenticeSchema>;
