/**
 * `npm run bench:report`: the completion report's build time and memory. A signed-off job of four
 * wheels on a 32-bolt ring (passes at 30, 70 and 100 % and a check pass, every bolt confirmed with
 * the in-lb wrench), two bead photos per wheel stored as phone pictures (3000×4000 JPEGs) in the
 * local upload fake, run in its own process so its buffers are not counted here. Then the PDF is
 * built through `renderJobReport`, what `GET /api/jobs/:id/report` calls, 1 + BENCH_BUILDS times
 * (default 10) in this process, and per build: wall time, CPU time, and peak RSS from the
 * kernel's high-water mark (VmHWM, reset before each build through /proc/self/clear_refs); the
 * V8 heap is sampled every 2 ms (a lower bound: the layout runs without yielding).
 * Last line: `report build p95 X s, peak RSS Y MB, at most +Z MB over the process before a build
 * (4 wheels, 32 bolts, 8 photos)`. With MALLOC_ARENA_MAX=2 the image library's threads leave
 * about 70 MB less behind (glibc's per-thread arenas).
 */
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { createInterface } from 'node:readline';
import os from 'node:os';
import v8 from 'node:v8';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
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

/** Peak RSS of this process since the last reset, from the kernel (Linux). */
const resetPeak = () => writeFileSync('/proc/self/clear_refs', '5');
const peakRss = () =>
  Number(/VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'))?.[1] ?? NaN) * 1024;

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
  const { signedOffJob } = await import('../helpers/report-work');
  const { getDb, closeDb } = await import('@/db');
  const { wheelPhotos } = await import('@/db/schema');
  const { eq } = await import('drizzle-orm');
  const { renderJobReport } = await import('@/features/reports/server/render-report');

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

    const build = async () => {
      const before = process.memoryUsage().rss;
      resetPeak();
      let heapPeak = process.memoryUsage().heapUsed;
      // A lower bound: the layout runs synchronously, and no timer fires during it.
      const sampler = setInterval(
        () => (heapPeak = Math.max(heapPeak, process.memoryUsage().heapUsed)),
        2,
      );
      const cpuBefore = process.cpuUsage();
      const started = performance.now();
      const { pdf } = await renderJobReport(shop.shopId, job.id);
      const ms = performance.now() - started;
      const cpu = process.cpuUsage(cpuBefore);
      clearInterval(sampler);
      heapPeak = Math.max(heapPeak, process.memoryUsage().heapUsed);
      // Every photo must be in the PDF: a build that left them out would measure nothing.
      const images = pdf.toString('latin1').split('/Subtype /Image').length - 1;
      if (images !== photos.length)
        throw new Error(`the PDF holds ${images} of ${photos.length} photos`);
      return {
        ms,
        // This process's CPU, the image library's threads included: steadier than wall time on
        // a shared machine (the upload fake runs in its own process).
        cpuMs: (cpu.user + cpu.system) / 1000,
        pages: pdf.toString('latin1').match(/\/Type \/Page\b/g)?.length ?? 0,
        before,
        rss: peakRss(),
        heapPeak,
        heapSize: v8.getHeapStatistics().total_heap_size,
        kb: pdf.byteLength / 1024,
      };
    };

    console.log(`[bench] load average ${os.loadavg()[0]!.toFixed(1)} (2 cores shared)`);
    const warm = await build();
    console.log(
      `[bench] warm-up build ${warm.ms.toFixed(0)} ms (fonts parsed, modules loaded), peak RSS ${(warm.rss / MB).toFixed(0)} MB`,
    );
    const runs = [];
    for (let i = 0; i < BUILDS; i++) {
      const r = await build();
      runs.push(r);
      console.log(
        `[bench] build ${i + 1}: ${r.ms.toFixed(0)} ms (CPU ${r.cpuMs.toFixed(0)} ms), ${r.pages} pages, ${r.kb.toFixed(0)} kB, peak RSS ${(r.rss / MB).toFixed(0)} MB (${(r.before / MB).toFixed(0)} MB before), V8 heap used ≥ ${(r.heapPeak / MB).toFixed(0)} MB of ${(r.heapSize / MB).toFixed(0)} MB`,
      );
    }
    const ms = runs.map((r) => r.ms);
    const cpuMs = runs.map((r) => r.cpuMs);
    const rss = Math.max(...runs.map((r) => r.rss));
    console.log(
      `[bench] ${BUILDS} builds: p50 ${(pct(ms, 50) / 1000).toFixed(2)} s, p95 ${(pct(ms, 95) / 1000).toFixed(2)} s, max ${(Math.max(...ms) / 1000).toFixed(2)} s; CPU p50 ${(pct(cpuMs, 50) / 1000).toFixed(2)} s; load average ${os.loadavg()[0]!.toFixed(1)}; V8 heap used peak ≥ ${(Math.max(...runs.map((r) => r.heapPeak)) / MB).toFixed(0)} MB (sampled)`,
    );
    // The process's own weight before a build (modules under tsx, the parsed fonts) is most of it.
    const growth = Math.max(...runs.map((r) => r.rss - r.before));
    console.log(
      `report build p95 ${(pct(ms, 95) / 1000).toFixed(2)} s, peak RSS ${(rss / MB).toFixed(0)} MB, at most +${(growth / MB).toFixed(0)} MB over the process before a build (4 wheels, ${BOLTS} bolts, ${photos.length} photos)`,
    );
  } finally {
    fake.stop();
    await closeDb();
  }
}

run(main);
