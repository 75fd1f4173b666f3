'use server';

import { revalidatePath } from 'next/cache';
import { reviewSources } from '@/app/_review/sources';
import { transitionJob } from '@/features/jobs/server/transitions';
import { getWorkFacts } from '@/features/jobs/server/work-facts';
import { getJob } from '@/features/jobs/server/jobs';
import { isSelfReview } from '@/features/jobs/transitions';
import { sendBackNote } from '@/features/review/acknowledge';
import { signOffReviewed } from '@/features/review/server/decide';
import { approveSchema, sendBackSchema } from '@/features/review/schemas';
import { scheduleFollowUp } from '@/features/follow-up/server/schedule';
import { memberAction } from '@/server/action';
import { DomainError } from '@/server/errors';

const refresh = (jobId: string) => {
  revalidatePath(`/jobs/${jobId}`);
  revalidatePath(`/jobs/${jobId}/review`);
  revalidatePath('/signoff');
};

/** Sign-off from the review: every blocking anomaly acknowledged, stored with the move in one transaction. */
export const approveReviewed = memberAction(
  { permission: 'jobs.signoff', schema: approveSchema },
  async (input, member) => {
    const [job, facts] = await Promise.all([
      getJob(member.shopId, input.jobId),
      getWorkFacts(member.shopId, input.jobId),
    ]);
    if (isSelfReview(member, job, 'sign_off', facts) && !input.note.trim()) {
      const message =
        'You worked on this job card: write why you are signing it off yourself; the reason is kept on the record.';
      throw new DomainError('invalid', message, { note: [message] });
    }
    const result = await signOffReviewed(member, input, reviewSources, (tx, note) =>
      transitionJob(member, input.jobId, 'sign_off', note, { tx, reviewed: true }),
    );
    // After the commit: the customer's e-mail and the re-check reminder go on the queue.
    await scheduleFollowUp(member.shopId, input.jobId);
    refresh(input.jobId);
    return { ...result, message: 'Signed off.' };
  },
);

/** Send-back from the review: the named wheels reopen, each with its own note for the technician. */
export const sendBackReviewed = memberAction(
  { permission: 'jobs.signoff', schema: sendBackSchema },
  async (input, member) => {
    const job = await getJob(member.shopId, input.jobId);
    const position = (id: string) => job.wheels.find((w) => w.id === id)?.position ?? 'Wheel';
    await transitionJob(
      member,
      input.jobId,
      'send_back',
      sendBackNote(input.wheels.map((w) => ({ position: position(w.wheelId), note: w.note }))),
      { wheels: input.wheels },
    );
    refresh(input.jobId);
    return { message: 'Sent back to the technician.' };
  },
);
