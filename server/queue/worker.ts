import 'server-only';
import type PgBoss from 'pg-boss';
import { startBoss } from './boss';
import { QUEUES, QUEUE_NAMES, SCHEDULES, type QueueHandlers, type QueueName } from './jobs';

/** Runs one job through its handler, its payload checked against the queue's schema first. */
export async function runJob(
  handlers: QueueHandlers,
  name: QueueName,
  job: PgBoss.JobWithMetadata<unknown>,
): Promise<void> {
  const data = QUEUES[name].payload.parse(job.data);
  const handler = handlers[name] as (
    d: unknown,
    a: Parameters<QueueHandlers[QueueName]>[1],
  ) => Promise<void>;
  await handler(data, { id: job.id, retryCount: job.retryCount, retryLimit: job.retryLimit });
}

export type Worker = { boss: PgBoss; stop: () => Promise<void> };

/**
 * A worker: its own boss, which keeps pg-boss's maintenance and cron clocks, works every queue one
 * job at a time per queue, and keeps the product's cron schedules. Several may run against one
 * database; pg-boss hands each job to one of them (SKIP LOCKED) and the handlers check their rows.
 */
export async function startWorker(
  handlers: QueueHandlers,
  options: { pollingIntervalSeconds?: number } = {},
): Promise<Worker> {
  const pollingIntervalSeconds = options.pollingIntervalSeconds ?? 2;
  const boss = await startBoss({ work: true, pollingIntervalSeconds });
  for (const name of QUEUE_NAMES) {
    await boss.work(
      name,
      { includeMetadata: true, batchSize: 1, pollingIntervalSeconds },
      async (jobs) => {
        for (const job of jobs) await runJob(handlers, name, job);
      },
    );
  }
  for (const { name, cron } of SCHEDULES) await boss.schedule(name, cron, {});
  return {
    boss,
    stop: () => boss.stop({ graceful: true, timeout: 15_000, wait: true }),
  };
}
