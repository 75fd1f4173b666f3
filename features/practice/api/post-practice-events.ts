import { eventsPoster } from '@/features/runner/api/post-events';

/**
 * How practice's outbox sends: `POST /api/practice/attempts/:id/events`, read by the runner's own
 * answer reader (the outbox calls the attempt's id `wheelId`, so practice and real wheels never
 * share a queue on the phone).
 */
export const postPracticeEvents = eventsPoster((id) => `/api/practice/attempts/${id}/events`);
