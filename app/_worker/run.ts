/**
 * `npm run worker`: works the queue (server/queue) until stopped. `npm start` runs one beside the
 * web server; a deployment runs as many as it likes, each with the app's DATABASE_URL and SMTP_URL.
 */
import { closeDb } from '@/db';
import { assertEnv } from '@/server/env.mjs';
import { startWorker } from '@/server/queue/worker';
import { queueHandlers } from './handlers';

async function main() {
  assertEnv();
  const worker = await startWorker(queueHandlers());
  console.log('[worker] working the queue (Ctrl+C stops it)');
  let stopping = false;
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    console.log(`[worker] ${signal}: finishing the jobs in hand…`);
    void worker
      .stop()
      .then(() => closeDb())
      .finally(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((error: unknown) => {
  console.error(`[worker] ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
