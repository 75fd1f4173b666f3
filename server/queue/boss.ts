import 'server-only';
import PgBoss from 'pg-boss';
import { env } from '@/server/env.mjs';
import { QUEUES, QUEUE_NAMES, type JobData, type QueueName } from './jobs';

/**
 * One pg-boss per process, in the app's own PostgreSQL (its tables live in the `pgboss` schema,
 * which pg-boss creates and migrates on start, under its own advisory lock). The web server's
 * boss only sends; `npm run worker` starts one that also works the queues and keeps the
 * maintenance and cron clocks (server/queue/worker.ts).
 */
const globalForBoss = globalThis as unknown as { ringpassBoss?: Promise<PgBoss> };

export type BossRole = { work: boolean; pollingIntervalSeconds?: number };

/** Starts a boss and makes sure every queue exists (createQueue is idempotent in pg-boss 10). */
export async function startBoss(
  role: BossRole,
  connectionString = env().DATABASE_URL,
): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString,
    max: role.work ? 4 : 2,
    supervise: role.work,
    schedule: role.work,
    ...(role.pollingIntervalSeconds ? { pollingIntervalSeconds: role.pollingIntervalSeconds } : {}),
  });
  boss.on('error', (error) => console.error('[queue]', error));
  await boss.start();
  for (const name of QUEUE_NAMES) {
    const { policy, retryLimit, retryDelay, retryBackoff, expireInSeconds } = QUEUES[name];
    await boss.createQueue(name, {
      name,
      policy,
      retryLimit,
      retryDelay,
      retryBackoff,
      expireInSeconds,
    });
  }
  return boss;
}

/** Creates or migrates pg-boss's schema and the queues (a test template, a deploy step). */
export async function installQueues(connectionString: string): Promise<void> {
  const boss = await startBoss({ work: false }, connectionString);
  await boss.stop({ graceful: false, wait: true });
}

/** The sending boss of this process, started on first use. */
export function getBoss(): Promise<PgBoss> {
  globalForBoss.ringpassBoss ??= startBoss({ work: false }).catch((error: unknown) => {
    globalForBoss.ringpassBoss = undefined;
    throw error;
  });
  return globalForBoss.ringpassBoss;
}

/** Stops this process's sending boss: for scripts and tests that must exit cleanly. */
export async function stopBoss(): Promise<void> {
  const pending = globalForBoss.ringpassBoss;
  globalForBoss.ringpassBoss = undefined;
  if (pending) await (await pending).stop({ graceful: false, wait: true });
}

export type SendOptions = { startAfter?: Date; singletonKey?: string };

/**
 * Queues one job, its payload checked against the queue's schema first. Returns the job's id, or
 * null when a job with the same key is already waiting (the queues with the `short` policy).
 */
export async function sendJob<N extends QueueName>(
  name: N,
  data: JobData<N>,
  options: SendOptions = {},
): Promise<string | null> {
  const payload = QUEUES[name].payload.parse(data) as object;
  const boss = await getBoss();
  return boss.send(name, payload, {
    ...(options.startAfter ? { startAfter: options.startAfter } : {}),
    ...(options.singletonKey ? { singletonKey: options.singletonKey } : {}),
  });
}
