import { can, type Permission } from '@/server/auth/permissions';
import type { Role } from '@/db/schema';
import type { JobStateName } from './schemas';

export type TransitionName = 'start' | 'submit' | 'sign_off' | 'send_back';

type Rule = {
  label: string;
  from: readonly JobStateName[];
  to: JobStateName;
  permission: Permission;
  /** run: the assignee (a lead may run any job); review: anyone with the permission but the assignee. */
  who: 'run' | 'review';
  noteRequired?: boolean;
};

/** The only moves a job card can make (PRODUCT.md's states); the server enforces them. */
export const TRANSITION_RULES: Record<TransitionName, Rule> = {
  start: { label: 'Start work', from: ['open', 'sent_back'], to: 'in_progress', permission: 'jobs.run', who: 'run' },
  submit: { label: 'Submit for sign-off', from: ['in_progress'], to: 'awaiting_signoff', permission: 'jobs.run', who: 'run' },
  sign_off: { label: 'Sign off', from: ['awaiting_signoff'], to: 'signed_off', permission: 'jobs.signoff', who: 'review' },
  send_back: { label: 'Send back', from: ['awaiting_signoff'], to: 'sent_back', permission: 'jobs.signoff', who: 'review', noteRequired: true },
};

export const STATE_LABELS: Record<JobStateName, string> = {
  open: 'Open',
  in_progress: 'In progress',
  awaiting_signoff: 'Awaiting sign-off',
  signed_off: 'Signed off',
  sent_back: 'Sent back',
};

type Actor = { userId: string; role: Role };
type JobLike = { state: JobStateName; assignee: { id: string } | null };

export type Refusal = { kind: 'state' | 'person'; message: string };

/** Why this actor may not make this move now (the job's state, or who they are), or null. */
export function transitionRefusal(actor: Actor, job: JobLike, name: TransitionName): Refusal | null {
  const rule = TRANSITION_RULES[name];
  if (!rule.from.includes(job.state)) {
    return { kind: 'state', message: `A job card that is ${STATE_LABELS[job.state].toLowerCase()} cannot be moved that way.` };
  }
  if (!can(actor.role, rule.permission)) return { kind: 'person', message: 'Your role does not allow this.' };
  const isAssignee = job.assignee?.id === actor.userId;
  if (rule.who === 'run' && !isAssignee && actor.role !== 'lead') return { kind: 'person', message: 'Only the assigned technician or a lead can do this.' };
  if (rule.who === 'review' && isAssignee) return { kind: 'person', message: 'A lead cannot sign off or send back their own work; ask another lead.' };
  return null;
}

export function allowedTransitions(actor: Actor, job: JobLike): TransitionName[] {
  return (Object.keys(TRANSITION_RULES) as TransitionName[]).filter((t) => transitionRefusal(actor, job, t) === null);
}
