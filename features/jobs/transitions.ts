import { can, type Permission } from '@/server/auth/permissions';
import type { Role } from '@/db/schema';
import type { JobStateName } from './schemas';

export type TransitionName = 'start' | 'submit' | 'sign_off' | 'send_back';

type Rule = {
  label: string;
  from: readonly JobStateName[];
  to: JobStateName;
  permission: Permission;
  /** run: the assignee (a lead may run any job); review: a lead who did none of the work. */
  who: 'run' | 'review';
  noteRequired?: boolean;
};

/** The only moves a job card can make (PRODUCT.md's states); the server enforces them. */
export const TRANSITION_RULES: Record<TransitionName, Rule> = {
  start: {
    label: 'Start work',
    from: ['open', 'sent_back'],
    to: 'in_progress',
    permission: 'jobs.run',
    who: 'run',
  },
  submit: {
    label: 'Submit for sign-off',
    from: ['in_progress'],
    to: 'awaiting_signoff',
    permission: 'jobs.run',
    who: 'run',
  },
  sign_off: {
    label: 'Sign off',
    from: ['awaiting_signoff'],
    to: 'signed_off',
    permission: 'jobs.signoff',
    who: 'review',
  },
  send_back: {
    label: 'Send back',
    from: ['awaiting_signoff'],
    to: 'sent_back',
    permission: 'jobs.signoff',
    who: 'review',
    noteRequired: true,
  },
};

export const STATE_LABELS: Record<JobStateName, string> = {
  open: 'Open',
  in_progress: 'In progress',
  awaiting_signoff: 'Awaiting sign-off',
  signed_off: 'Signed off',
  sent_back: 'Sent back',
};

type Actor = { userId: string; role: Role; clearedForRealWheels?: boolean };
type JobLike = {
  state: JobStateName;
  assignee: { id: string } | null;
  wheels: readonly {
    position?: string;
    submittedAt: string | null;
    flaggedReason: string | null;
  }[];
};

/**
 * What the server knows about the work on a job beyond the card itself. `workerIds`: everyone who
 * recorded a runner event on it (superseded ones included), submitted one of its wheels, or
 * submitted the job. `selfSignoffAllowed`: the shop's single-lead setting is on and the shop has
 * exactly one lead. Without `workerIds` (a screen that did not load them) the assignee stands in.
 */
export type WorkFacts = { workerIds?: readonly string[]; selfSignoffAllowed?: boolean };

/** `record`: the job's wheels are not ready for this move (409 like `state`). */
export type Refusal = { kind: 'state' | 'record' | 'person'; message: string };

/** Whether this lead worked on the job: judged by the work recorded, not by who is assigned now. */
export function didWork(actor: Actor, job: JobLike, facts: WorkFacts): boolean {
  return facts.workerIds
    ? facts.workerIds.includes(actor.userId)
    : job.assignee?.id === actor.userId;
}

/** Why the job's wheels do not allow submitting it yet, or null: at least one wheel, all submitted, none flagged. */
export function submitRefusal(job: JobLike): Refusal | null {
  if (job.wheels.length === 0)
    return {
      kind: 'record',
      message: 'A job card with no wheels has no work to submit; add its wheels first.',
    };
  const flagged = job.wheels.filter((w) => w.flaggedReason);
  if (flagged.length)
    return {
      kind: 'record',
      message: `A wheel is flagged (${flagged.map((w) => w.position ?? 'wheel').join(', ')}): a lead must look at it before the job can be submitted.`,
    };
  const open = job.wheels.filter((w) => !w.submittedAt);
  if (open.length)
    return {
      kind: 'record',
      message: `Every wheel must be run and submitted first; still open: ${open.map((w) => w.position ?? 'wheel').join(', ')}.`,
    };
  return null;
}

/** Why this actor may not make this move now (the job's state, its wheels, or who they are), or null. */
export function transitionRefusal(
  actor: Actor,
  job: JobLike,
  name: TransitionName,
  facts: WorkFacts = {},
): Refusal | null {
  const rule = TRANSITION_RULES[name];
  if (!rule.from.includes(job.state)) {
    return {
      kind: 'state',
      message: `A job card that is ${STATE_LABELS[job.state].toLowerCase()} cannot be moved that way.`,
    };
  }
  if (!can(actor, rule.permission))
    return { kind: 'person', message: 'Your role does not allow this.' };
  const isAssignee = job.assignee?.id === actor.userId;
  if (rule.who === 'run' && !isAssignee && actor.role !== 'lead')
    return { kind: 'person', message: 'Only the assigned technician or a lead can do this.' };
  if (rule.who === 'review' && didWork(actor, job, facts) && !facts.selfSignoffAllowed) {
    return {
      kind: 'person',
      message:
        'You worked on this job card (recorded its steps or submitted it): another lead must sign it off or send it back.',
    };
  }
  if (name === 'submit') return submitRefusal(job);
  return null;
}

/** A review by the lead who did the work, allowed by the single-lead setting: it needs a written reason. */
export function isSelfReview(
  actor: Actor,
  job: JobLike,
  name: TransitionName,
  facts: WorkFacts,
): boolean {
  return (
    TRANSITION_RULES[name].who === 'review' &&
    didWork(actor, job, facts) &&
    Boolean(facts.selfSignoffAllowed)
  );
}

export function allowedTransitions(
  actor: Actor,
  job: JobLike,
  facts: WorkFacts = {},
): TransitionName[] {
  return (Object.keys(TRANSITION_RULES) as TransitionName[]).filter(
    (t) => transitionRefusal(actor, job, t, facts) === null,
  );
}
