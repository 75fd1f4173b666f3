import { afterAll, beforeAll } from 'vitest';
import { defaultDeps, queueHandlers, type WorkerDeps } from '@/app/_worker/handlers';
import { getBoss } from '@/server/queue/boss';
import { QUEUE_NAMES, type QueueName } from '@/server/queue/jobs';
import { runJob, startWorker, type Worker } from '@/server/queue/worker';

/**
 * A real worker for this test file (as `npm run worker` runs), polling every half second: for
 * tests that read mail the app now sends from the queue. Stopped after the file.
 */
export function runQueueWorker(deps: Partial<WorkerDeps> = {}) {
  let worker: Worker | undefined;
  beforeAll(async () => {
    worker = await startWorker(queueHandlers({ ...defaultDeps, ...deps }), {
      pollingIntervalSeconds: 0.5,
    });
  });
  afterAll(async () => {
    await worker?.boss.stop({ graceful: false, wait: true });
  });
}

/**
 * Works, once, every job that is ready (or, with `ignoreStartAfter`, every waiting one, as if
 * its time had come), through the real handlers and pg-boss's complete/fail and retry count.
 * Returns how many jobs ran. Deterministic: no polling, no clock.
 */
export async function drainQueues(
  deps: Partial<WorkerDeps> = {},
  options: { names?: QueueName[]; ignoreStartAfter?: boolean } = {},
): Promise<number> {
  const boss = await getBoss();
  const handlers = queueHandlers({ ...defaultDeps, ...deps });
  let ran = 0;
  for (const name of options.names ?? QUEUE_NAMES) {
    for (;;) {
      const jobs = await boss.fetch<unknown>(name, {
        includeMetadata: true,
        batchSize: 20,
        ignoreStartAfter: options.ignoreStartAfter ?? false,
      });
      if (!jobs.length) break;
      for (const job of jobs) {
        ran += 1;
        try {
          await runJob(handlers, name, job);
          await boss.complete(name, job.id);
        } catch (error) {
          await boss.fail(name, job.id, { message: String(error) });
        }
      }
    }
  }
  return ran;
}
