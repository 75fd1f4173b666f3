/**
 * EXPLAIN (ANALYZE, BUFFERS) of one growth-bench operation on the databases `BENCH_KEEP=1 npm run
 * bench:growth` kept, without regenerating or timing anything: for checking a plan or an index
 * in seconds instead of the bench's minutes. The operation's statements are the real code's
 * (growth-measure.ts), captured then explained in a rolled-back transaction each.
 * `npx tsx --tsconfig tests/bench/tsconfig.json tests/bench/growth-explain.ts [read|confirm|replay]`
 * (default confirm). Each database is explained twice, to show the variation.
 */
import { clusterUrl, startCluster } from '@/db/cluster';
import { explainCaptured, openCapturingDb } from './growth-db';
import { run } from './production-server';

const DATABASES = ['ringpass_bench_growth_small', 'ringpass_bench_growth'];

async function main() {
  const op = process.argv[2] ?? 'confirm';
  if (op !== 'read' && op !== 'confirm' && op !== 'replay') throw new Error(`unknown ${op}`);
  await startCluster();
  Object.assign(process.env, {
    DATABASE_URL: clusterUrl(DATABASES[0]!),
    SMTP_URL: 'smtp://127.0.0.1:2599',
    NODE_ENV: 'production',
  });
  // After the environment is set: the app's modules read it when they load.
  const { captureOne } = await import('./growth-measure');
  for (const name of DATABASES) {
    const db = await openCapturingDb(clusterUrl(name));
    try {
      for (const round of [1, 2]) {
        const statements = await captureOne(db, op);
        console.log(
          `\n[growth-explain] ${name}: ${op} (${round} of 2), ${statements.length} statement(s)`,
        );
        console.log(await explainCaptured(db, statements));
      }
    } finally {
      await db.close();
    }
  }
}

run(main);
