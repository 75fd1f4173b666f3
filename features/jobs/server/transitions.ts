import 'server-only';
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobEvents, jobs, jobWheels } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError } from '@/server/errors';
import { queueTransitionNotices } from '@/server/mail/job-notices';
import type { SendBackWheel } from '../schemas';
import {
  isSelfReview,
  TRANSITION_RULES,
  transitionRefusal,
  type TransitionName,
} from '../transitions';
import { getJob, type JobCard } from './jobs';
import { reopenWheels, sendBackWheels } from './send-back';
import { getWorkFacts } from './work-facts';

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

const noteError = (message: string) => new DomainError('invalid', message, { note: [message] });

/**
 * Moves a job card along one allowed transition, recorded with who, when and why. Submit needs
 * every wheel submitted and none flagged; sign-off and send-back need a lead who did none of the
 * work (the single-lead setting allows that lead with a written reason, kept on the record); a
 * send-back reopens the wheels it names. `tx` lets the runner's save path start a job inside the
 * transaction that stores its first event.
 */
export async function transitionJob(
  actor: Member,
  jobId: string,
  name: TransitionName,
  note: string,
  options: { wheels?: SendBackWheel[]; tx?: Tx; reviewed?: boolean } = {},
): Promise<JobCard> {
  const job = await getJob(actor.shopId, jobId);
  const facts =
    TRANSITION_RULES[name].who === 'review' ? await getWorkFacts(actor.shopId, jobId) : {};
  const refusal = transitionRefusal(actor, job, name, facts);
  if (refusal)
    throw new DomainError(refusal.kind === 'person' ? 'forbidden' : 'conflict', refusal.message);
  const rule = TRANSITION_RULES[name];
  const reason = note.trim();
  if (rule.noteRequired && !reason)
    throw noteError('Say what needs fixing, so the technician knows.');
  const selfReview = isSelfReview(actor, job, name, facts);
  if (selfReview && !reason)
    throw noteError(
      'You worked on this job card: write why you are signing it off yourself; the reason is kept on the record.',
    );
  // A sign-off is the product's promise: it lands only through the review, which computes the
  // anomalies again and stores the lead's reason for each that blocks (features/review).
  if (name === 'sign_off' && !options.reviewed) {
    throw new DomainError(
      'conflict',
      "Sign off from the job's review, where its anomalies are checked and each one that blocks gets your reason.",
    );
  }
  const reopened = name === 'send_back' ? sendBackWheels(job, reason, options.wheels) : null;

  const move = async (tx: Tx) => {
    // Only from the state and assignee we checked: a second device that moved or reassigned it
    // first wins, this one is told. A submit also re-checks the wheels at the moment of writing.
    const sameAssignee = job.assignee
      ? eq(jobs.assigneeId, job.assignee.id)
      : isNull(jobs.assigneeId);
    const wheelsReady =
      name === 'submit'
        ? sql`exists (select 1 from ${jobWheels} w where w.job_id = ${jobId}) and not exists (select 1 from ${jobWheels} w where w.job_id = ${jobId} and (w.submitted_at is null or w.flagged_reason is not null))`
        : sql`true`;
    const moved = await tx
      .update(jobs)
      .set({ state: rule.to, updatedAt: new Date() })
      .where(
        and(
          eq(jobs.shopId, actor.shopId),
          eq(jobs.id, jobId),
          inArray(jobs.state, [job.state]),
          sameAssignee,
          wheelsReady,
        ),
      )
      .returning({ id: jobs.id });
    if (!moved.length)
      throw new DomainError('conflict', 'The job card changed meanwhile; reload and try again.');
    const at = new Date();
    if (reopened) await reopenWheels(tx, actor.shopId, actor.userId, reopened, at);
    await tx.insert(jobEvents).values({
      shopId: actor.shopId,
      jobId,
      action: name,
      fromState: job.state,
      toState: rule.to,
      byId: actor.userId,
      note: reason,
      selfSignoff: selfReview && name === 'sign_off',
      wheels: reopened,
      at,
    });
  };
  if (options.tx) {
    await move(options.tx);
    return { ...job, state: rule.to };
  }
  await getDb().transaction(move);
  // After the commit, through the queue: leads hear of a job awaiting sign-off, the technician
  // of a send-back.
  await queueTransitionNotices({
    shopId: actor.shopId,
    jobId,
    action: name,
    byId: actor.userId,
    wheels: reopened,
  });
  return getJob(actor.shopId, jobId);
}
