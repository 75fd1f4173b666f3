import 'server-only';
import { and, eq, inArray, isNull } from 'drizzle-orm';
import { getDb } from '@/db';
import { jobEvents, jobs } from '@/db/schema';
import type { Member } from '@/server/auth/session';
import { DomainError } from '@/server/errors';
import { TRANSITION_RULES, transitionRefusal, type TransitionName } from '../transitions';
import { getJob, type JobCard } from './jobs';

/** Moves a job card along one allowed transition, recorded with who, when and why. */
export async function transitionJob(actor: Member, jobId: string, name: TransitionName, note: string): Promise<JobCard> {
  const job = await getJob(actor.shopId, jobId);
  const refusal = transitionRefusal(actor, job, name);
  if (refusal) throw new DomainError(refusal.kind === 'state' ? 'conflict' : 'forbidden', refusal.message);
  const rule = TRANSITION_RULES[name];
  if (rule.noteRequired && !note.trim()) {
    throw new DomainError('invalid', 'Say what needs fixing, so the technician knows.', { note: ['Say what needs fixing, so the technician knows.'] });
  }
  await getDb().transaction(async (tx) => {
    // Only from the state and assignee we checked: a second device that moved or reassigned it
    // first wins, this one is told.
    const sameAssignee = job.assignee ? eq(jobs.assigneeId, job.assignee.id) : isNull(jobs.assigneeId);
    const moved = await tx
      .update(jobs)
      .set({ state: rule.to, updatedAt: new Date() })
      .where(and(eq(jobs.shopId, actor.shopId), eq(jobs.id, jobId), inArray(jobs.state, [job.state]), sameAssignee))
      .returning({ id: jobs.id });
    if (!moved.length) throw new DomainError('conflict', 'The job card changed meanwhile; reload and try again.');
    await tx.insert(jobEvents).values({ shopId: actor.shopId, jobId, action: name, fromState: job.state, toState: rule.to, byId: actor.userId, note: note.trim() });
  });
  return getJob(actor.shopId, jobId);
}
