/**
 * `npm run bench:report`: the completion report's build time and memory. A signed-off job of four
 * wheels on a 32-bolt ring (passes at 30, 70 and 100 % and a check pass, every bolt confirmed with
 * the in-lb wrench), two bead photos per wheel stored as phone pictures (3000×4000 JPEGs) in the
 * local upload fake, run in its own process so its buffers are not counted.
 *
 * Reports are built in two kinds of process: the Next server (`GET /api/jobs/:id/report`,
 * `/r/<token>/report.pdf`) and the queue's worker (the customer e-mail's PDF, `npm run worker` and
 * beside `npm start`). The builds here run in a child of the worker's shape (report-builder.ts:
 * compiled as the worker is, server/dev/worker-build.ts, and run under plain node; the worker's
 * modules loaded first; the environment the start scripts give it), through `renderJobReport`, 1 + BENCH_BUILDS times (default 10). Per build: wall time,
 * CPU time of the whole process (the image library's threads included) and peak RSS from the
 * kernel's high-water mark (VmHWM, reset before each build through /proc/self/clear_refs). The
 * builds run back to back; BENCH_PAUSE_MS=15000 idles between them as a worker does between e-mails.
 * Last line: build p95, CPU p50, and the process's RSS before its first build, its peak during the
 * builds and the difference (what building reports costs the process that builds them), and the
 * first build's own peak (a worker's first report loads the PDF and image libraries). The Next
 * server's shape is not measured here (it needs a production build); it loads the same report
 * modules with its first report.
 */
import { spawn, spawnSync } from 'node:child_process';
import { rmSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { createInterface } from 'node:readline';
import os from 'node:os';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { serverProcessEnv } from '@/server/dev/stack-plan';
import { buildWorker } from '@/server/dev/worker-build';
import { ROOT } from '../helpers/test-services';
import { pct, run } from './production-server';

const DB = 'ringpass_bench_report';
const BUILDS = Number(process.env.BENCH_BUILDS ?? 10);
const BOLTS = 32;
const UPLOADS = path.join(ROOT, '.data', 'bench-uploads');
const MB = 1024 * 1024;
const TSX = path.join(ROOT, 'node_modules', '.bin', 'tsx');

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const probe = net.createServer().once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });

/** The upload fake in a child process; resolves with the SDK's env once it listens. */
async function startFakeProcess() {
  rmSync(UPLOADS, { recursive: true, force: true });
  const child = spawn(
    TSX,
    ['tests/bench/upload-fake-process.ts', String(await freePort()), UPLOADS],
    { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] },
  );
  const [line] = await createInterface({ input: child.stdout })
    [Symbol.asyncIterator]()
    .next()
    .then((r) => [r.value as string | undefined]);
  if (!line) throw new Error('the upload fake did not start');
  return { env: JSON.parse(line) as Record<string, string>, stop: () => child.kill('SIGTERM') };
}

type Build = { ms: number; cpuMs: number; peak: number };
type BuilderResult = {
  baseline: number;
  first: Build;
  runs: Build[];
  end: number;
  arenaMax: string | null;
  pauseMs: number;
};

async function main() {
  await startCluster();
  await recreateDatabase(DB);
  await migrateDatabase(clusterUrl(DB));
  const fake = await startFakeProcess();
  // The app reads its configuration on first use: set it before any app module runs.
  Object.assign(process.env, fake.env, {
    DATABASE_URL: clusterUrl(DB),
    SMTP_URL: 'smtp://127.0.0.1:2599',
  });
  // As `npm start` starts its worker: its process environment (MALLOC_ARENA_MAX), production.
  const builderEnv = {
    ...process.env,
    ...serverProcessEnv(process.env),
    NODE_ENV: 'production' as const,
  };
  const { signedOffJob } = await import('../helpers/report-work');
  const { getDb, closeDb } = await import('@/db');
  const { wheelPhotos } = await import('@/db/schema');
  const { eq } = await import('drizzle-orm');

  try {
    const { shop, job } = await signedOffJob(new Date(), {
      boltCount: BOLTS,
      name: `Bench ${BOLTS}-bolt ring`,
    });
    const photos = await getDb()
      .select({ fileKey: wheelPhotos.fileKey })
      .from(wheelPhotos)
      .where(eq(wheelPhotos.jobId, job.id));
    const made = spawnSync(
      TSX,
      ['tests/bench/phone-photos.ts', UPLOADS, ...photos.map((p) => p.fileKey)],
      { cwd: ROOT, encoding: 'utf8' },
    );
    if (made.status !== 0) throw new Error(`phone-photos failed: ${made.stderr}`);
    console.log(
      `[bench] ${photos.length} photos stored, 3000×4000 JPEG, ${made.stdout.trim()} MB each`,
    );

    // The builds run in a process of the worker's shape (report-builder.ts): what a report costs
    // is measured in a process that holds only what the worker holds, not this bench's own modules.
    console.log(`[bench] load average ${os.loadavg()[0]!.toFixed(1)} (2 cores shared)`);
    const builder = buildWorker({
      entry: 'tests/bench/report-builder.ts',
      outdir: '.data/bench-worker',
    });
    const child = spawnSync(
      process.execPath,
      [builder, shop.shopId, job.id, String(photos.length), String(BUILDS)],
      { cwd: ROOT, env: builderEnv, encoding: 'utf8', stdio: ['ignore', 'pipe', 'inherit'] },
    );
    const out = child.stdout.trim().split('\n');
    if (child.status !== 0) throw new Error(`the report builder failed: ${out.join('\n')}`);
    const result = JSON.parse(out.pop()!) as BuilderResult;
    for (const l of out) console.log(l);
    const runs = result.runs;
    const ms = runs.map((r) => r.ms);
    const cpuMs = runs.map((r) => r.cpuMs);
    const peak = Math.max(result.first.peak, ...runs.map((r) => r.peak));
    console.log(
      `[bench] ${BUILDS} builds: p50 ${(pct(ms, 50) / 1000).toFixed(2)} s, p95 ${(pct(ms, 95) / 1000).toFixed(2)} s, max ${(Math.max(...ms) / 1000).toFixed(2)} s; CPU p50 ${(pct(cpuMs, 50) / 1000).toFixed(2)} s, p95 ${(pct(cpuMs, 95) / 1000).toFixed(2)} s; RSS after the last build ${(result.end / MB).toFixed(0)} MB; load average ${os.loadavg()[0]!.toFixed(1)}`,
    );
    console.log(
      `report build p95 ${(pct(ms, 95) / 1000).toFixed(2)} s, CPU p50 ${(pct(cpuMs, 50) / 1000).toFixed(2)} s; worker-shaped process RSS ${(result.baseline / MB).toFixed(0)} MB before the first build, peak ${(peak / MB).toFixed(0)} MB during ${BUILDS + 1} builds (+${((peak - result.baseline) / MB).toFixed(0)} MB; the first build ${(result.first.peak / MB).toFixed(0)} MB) (4 wheels, ${BOLTS} bolts, ${photos.length} photos; MALLOC_ARENA_MAX=${result.arenaMax ?? 'unset'}${result.pauseMs ? `, ${result.pauseMs} ms between builds` : ', back to back'})`,
    );
  } finally {
    fake.stop();
    await closeDb();
  }
}

run(main);
