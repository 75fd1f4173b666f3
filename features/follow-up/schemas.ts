import { z } from 'zod';
import { isoDate } from '@/features/ui/bounded';

const jobId = z.uuid({ error: 'Unknown job card.' });

export const followUpJobSchema = z.object({ jobId });
export const rescheduleSchema = z.object({ jobId, dueOn: isoDate('the re-check date') });
export type RescheduleInput = z.infer<typeof rescheduleSchema>;
