/**
 * `npm run bench:growth`: the runner's read and save paths with 10,000 rows in wheel_run_events and
 * with 10 million, each in its own database (ringpass_bench_growth_small, ringpass_bench_growth).
 * The real code runs in-process: the wheel's events as GET /api/wheels/:id/events reads them
 * (loadWheel, listEvents, reduceRun), a confirmation through saveWheelBatch (its one-statement
 * path), and a replayed confirmation (its transaction). Sizes alternate in rounds so load on the
 * shared machine falls on both alike. Prints EXPLAIN (ANALYZE, BUFFERS) of each statement at both
 * sizes and the table's disk use. Generating 10 million rows takes minutes: `BENCH_KEEP=1` keeps
 * both databases and reuses the big one (`BENCH_GENERATE_ONLY=1` only makes them); otherwise they
 * are dropped at the end.
 * Last lines: `<operation> p95 small X ms, 10M Y ms, ratio Z` (target ≤ 1.5).
 */
import postgres from 'postgres';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { explainCaptured, openCapturingDb, type CapturingDb } from './growth-db';
import { fillEvents, MEASURED_WHEELS, seedShops } from './growth-seed';
import { pct, run } from './production-server';

const SMALL = { name: 'ringpass_bench_growth_small', rows: 10_000 };
const BIG = {
  name: 'ringpass_bench_growth',
  rows: Number(process.env.BENCH_GROWTH_ROWS ?? 10_000_000),
};
const KEEP = process.env.BENCH_KEEP === '1';
const ROUNDS = 3;
const PER_ROUND = 100;

async function prepare(db: { name: string; rows: number }, reuse: boolean) {
  const admin = postgres(clusterUrl('postgres'), { max: 1, onnotice: () => {} });
  const [exists] = await admin`select 1 from pg_database where datname = ${db.name}`;
  await admin.end();
  if (reuse && exists) {
    const sql = postgres(clusterUrl(db.name), { max: 1, onnotice: () => {} });
    const [{ n }] = (await sql`select count(*)::int as n from wheel_run_events`) as [{ n: number }];
    if (n >= db.rows) {
      // Earlier runs' confirmations and wrench choices on the measured wheels go, so their wheels
      // are as long as the fresh 10,000-row database's (the save's checks read a wheel's events),
      // then vacuum.
      const gone = await sql`
        delete from wheel_run_events e using bench_wheels b
        where b.wheel_id = e.wheel_id and b.ord <= ${MEASURED_WHEELS}
          and e.type in ('bolt_confirmed', 'wrench_chosen') and e.received_at > now() - interval '30 days'`;
      await sql`vacuum (index_cleanup on) wheel_run_events`;
      await sql.end();
      return console.log(
        `[growth] reusing ${db.name} (${n} events, ${gone.count} left by earlier runs removed)`,
      );
    }
    await sql.end();
  }
  await recreateDatabase(db.name);
  await migrateDatabase(clusterUrl(db.name));
  const sql = postgres(clusterUrl(db.name), { max: 1, onnotice: () => {} });
  await seedShops(sql);
  await fillEvents(sql, db.rows, db.name);
  await sql.end();
}

async function main() {
  await startCluster();
  await prepare(SMALL, false);
  await prepare(BIG, KEEP);
  // Generating takes minutes: `BENCH_GENERATE_ONLY=1 BENCH_KEEP=1` makes the data and stops.
  if (process.env.BENCH_GENERATE_ONLY === '1') return;
  Object.assign(process.env, {
    DATABASE_URL: clusterUrl(SMALL.name),
    SMTP_URL: 'smtp://127.0.0.1:2599',
    NODE_ENV: 'production',
  });
  const small = await openCapturingDb(clusterUrl(SMALL.name));
  const big = await openCapturingDb(clusterUrl(BIG.name));
  const { measure } = await import('./growth-measure');
  const times: Record<string, { small: number[]; big: number[] }> = {};
  const add = (size: 'small' | 'big', got: Record<string, number[]>) => {
    for (const [op, xs] of Object.entries(got))
      (times[op] ??= { small: [], big: [] })[size].push(...xs);
  };
  try {
    for (const db of [small, big]) await measure(db, 20); // warm-up: caches, prepared statements
    for (let round = 1; round <= ROUNDS; round++) {
      add('small', await measure(small, PER_ROUND));
      add('big', await measure(big, PER_ROUND));
      console.log(`[growth] round ${round} of ${ROUNDS} done`);
    }
    const sizes = [
      ['10,000 rows', small],
      ['10 million rows', big],
    ] as const;
    const { throughput } = await import('./growth-measure');
    for (const [label, db] of sizes) {
      const perSecond = await throughput(db, 10, 8);
      console.log(
        `[growth] ${label}: ${perSecond.toFixed(0)} confirmations/s in-process, 8 at once for 10 s (no wrench named)`,
      );
    }
    for (const [label, db] of sizes) await printPlans(label, db);
    await printDiskUse(big);
    for (const [op, t] of Object.entries(times)) {
      console.log(
        `${op} p95 small ${pct(t.small, 95).toFixed(2)} ms (p50 ${pct(t.small, 50).toFixed(2)}), 10M ${pct(t.big, 95).toFixed(2)} ms (p50 ${pct(t.big, 50).toFixed(2)}), ratio ${(pct(t.big, 95) / pct(t.small, 95)).toFixed(2)}`,
      );
    }
  } finally {
    await small.close();
    await big.close();
    if (!KEEP) for (const db of [SMALL, BIG]) await dropDatabase(db.name);
  }
}

/** One read, one confirmation and one replay with every statement captured, then explained. */
async function printPlans(label: string, db: CapturingDb) {
  const { captureOne } = await import('./growth-measure');
  for (const op of ['read', 'confirm', 'replay'] as const) {
    const statements = await captureOne(db, op);
    console.log(`\n[growth] ${label}: ${op}, ${statements.length} statement(s)`);
    console.log(await explainCaptured(db, statements));
  }
}

async function printDiskUse(db: CapturingDb) {
  const [row] = await db.sql`
    select count(*)::bigint as rows, pg_total_relation_size('wheel_run_events') as total,
      pg_relation_size('wheel_run_events') as heap, pg_indexes_size('wheel_run_events') as indexes
    from wheel_run_events`;
  const { rows, total, heap, indexes } = row as Record<string, string>;
  const mb = (x: string) => (Number(x) / 2 ** 20).toFixed(0);
  console.log(
    `\n[growth] disk: ${Number(rows).toLocaleString('en')} events take ${mb(total!)} MB (heap ${mb(heap!)} MB, indexes ${mb(indexes!)} MB, TOAST and maps the rest): ${(Number(total) / Number(rows)).toFixed(0)} bytes per row all in`,
  );
  const perIndex = await db.sql`
    select indexrelname as name, pg_relation_size(indexrelid) as bytes from pg_stat_user_indexes where relname = 'wheel_run_events'`;
  for (const i of perIndex)
    console.log(`[growth]   ${i.name as string}: ${mb(i.bytes as string)} MB`);
}

async function dropDatabase(name: string) {
  const admin = postgres(clusterUrl('postgres'), { max: 1, onnotice: () => {} });
  await admin.unsafe(`drop database if exists ${name} with (force)`);
  await admin.end();
}

run(main);
