import 'server-only';
import { z } from 'zod';

/**
 * Every queue of the product, its payload and its delivery policy, in one place: the web server
 * sends with these names and the worker (`npm run worker`) checks each payload against the same
 * schema before it acts. Handlers must be safe to run twice (several workers may run, and a job
 * whose worker died is handed out again): each one checks a status row before it sends.
 */
// Payloads are made by the server itself (never typed by a person); checked again on receipt.
const id = z.uuid();
const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);
const text = (max: number) => z.string().max(max);

/** Mail goes out again a minute later, then two, four, eight… (pg-boss's exponential backoff). */
const mailRetry = { retryLimit: 5, retryDelay: 60, retryBackoff: true, expireInSeconds: 300 };

export const QUEUES = {
  /** The ring-bolt re-check reminder, due the shop's re-check days after sign-off. */
  'recheck-reminder': {
    payload: z.object({ shopId: id, jobId: id, dueOn: day }),
    // One waiting job per job card and due day (the key), the row's status says if it is still wanted.
    policy: 'short',
    ...mailRetry,
  },
  /** The customer's completion e-mail (report attached, link inside). */
  'customer-report-email': {
    payload: z.object({ shopId: id, jobId: id }),
    policy: 'short',
    ...mailRetry,
  },
  /** Submit → the other leads; send-back → the assignee (server/mail/job-notices.ts). */
  'job-notice': {
    payload: z.object({
      shopId: id,
      jobId: id,
      action: z.enum(['submit', 'send_back']),
      byId: id,
      wheels: z
        .array(z.object({ wheelId: id, note: text(2000), steps: z.array(text(60)).max(40) }))
        .max(16)
        .nullish(),
    }),
    policy: 'standard',
    ...mailRetry,
    retryLimit: 3,
  },
  /** A team invite's e-mail (features/accounts): the worker issues the link and sends it. */
  'invite-email': {
    payload: z.object({ shopId: id, inviteId: id, inviterName: text(200) }),
    policy: 'standard',
    ...mailRetry,
    retryLimit: 3,
  },
  /** Takes overdue wrenches out of service in every shop (the tool crib). */
  'wrench-overdue-sweep': {
    payload: z.object({}),
    policy: 'short',
    retryLimit: 2,
    retryDelay: 60,
    retryBackoff: false,
    expireInSeconds: 600,
  },
} as const satisfies Record<
  string,
  {
    payload: z.ZodType;
    policy: 'standard' | 'short';
    retryLimit: number;
    retryDelay: number;
    retryBackoff: boolean;
    expireInSeconds: number;
  }
>;

export type QueueName = keyof typeof QUEUES;
export type JobData<N extends QueueName> = z.infer<(typeof QUEUES)[N]['payload']>;
export const QUEUE_NAMES = Object.keys(QUEUES) as QueueName[];

/** Cron jobs the worker keeps scheduled (UTC; the sweep reads each shop's own calendar). */
export const SCHEDULES: { name: QueueName; cron: string }[] = [
  { name: 'wrench-overdue-sweep', cron: '5 * * * *' },
];

/** What a handler learns of the attempt: the last one may give up and say why. */
export type JobAttempt = { id: string; retryCount: number; retryLimit: number };
export const isLastAttempt = (a: JobAttempt) => a.retryCount >= a.retryLimit;

export type QueueHandlers = {
  [N in QueueName]: (data: JobData<N>, attempt: JobAttempt) => Promise<void>;
};
