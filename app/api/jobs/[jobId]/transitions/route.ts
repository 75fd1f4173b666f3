import { z } from 'zod';
import { reviewSources } from '@/app/_review/sources';
import { ids, transitionSchema } from '@/features/jobs/schemas';
import { getJob } from '@/features/jobs/server/jobs';
import { transitionJob } from '@/features/jobs/server/transitions';
import { getWorkFacts } from '@/features/jobs/server/work-facts';
import { isSelfReview, transitionRefusal } from '@/features/jobs/transitions';
import { acknowledgementSchema } from '@/features/review/schemas';
import { scheduleFollowUp } from '@/features/follow-up/server/schedule';
import { signOffReviewed } from '@/features/review/server/decide';
import { DomainError } from '@/server/errors';
import { apiRoute } from '@/server/http/handler';

const body = transitionSchema.extend({
  /** With sign_off: a reason for each anomaly that blocks, by its key (GET /api/jobs/:id/review). */
  acknowledgements: z
    .array(acknowledgementSchema, { error: 'Send the acknowledgements as a list.' })
    .max(200)
    .default([]),
});

// Who may make which move is decided per job (assignee, lead, not own work) in the server layer.
// A sign-off goes through the review like the review page's: anomalies computed again, each that
// blocks needs its reason, stored with the move.
export const POST = apiRoute(
  { permission: 'jobs.view', params: z.object({ jobId: ids.job }), body },
  async ({ member, params, body }) => {
    if (body.action !== 'sign_off')
      return {
        data: await transitionJob(member, params.jobId, body.action, body.note, {
          wheels: body.wheels,
        }),
      };
    const [job, facts] = await Promise.all([
      getJob(member.shopId, params.jobId),
      getWorkFacts(member.shopId, params.jobId),
    ]);
    const refusal = transitionRefusal(member, job, 'sign_off', facts);
    if (refusal)
      throw new DomainError(refusal.kind === 'person' ? 'forbidden' : 'conflict', refusal.message);
    // Checked on the lead's own words: the note the move stores also lists the acknowledgements.
    if (isSelfReview(member, job, 'sign_off', facts) && !body.note.trim()) {
      const message =
        'You worked on this job card: write why you are signing it off yourself; the reason is kept on the record.';
      throw new DomainError('invalid', message, { note: [message] });
    }
    await signOffReviewed(
      member,
      { jobId: params.jobId, note: body.note, acknowledgements: body.acknowledgements },
      reviewSources,
      (tx, note) => transitionJob(member, params.jobId, 'sign_off', note, { tx, reviewed: true }),
    );
    // After the commit: the customer's e-mail and the re-check reminder go on the queue.
    await scheduleFollowUp(member.shopId, params.jobId);
    return { data: await getJob(member.shopId, params.jobId) };
  },
);
