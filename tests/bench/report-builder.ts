/**
 * The process that builds reports in `npm run bench:report`, shaped as the queue's worker
 * (`npm run worker`, which builds the customer e-mail's PDF): compiled with the worker's own
 * esbuild options (server/dev/worker-build.ts) and run under plain node as the worker is, the same
 * modules loaded before any job arrives (app/_worker/run.ts's imports), the same environment. Only
 * then is anything measured, so its baseline is the worker's own and a build's cost is what a
 * build adds to it.
 *
 * report.ts builds it into .data/bench-worker/ and runs `node .data/bench-worker/report-builder.mjs
 * <shopId> <jobId> <photos> <builds>`; it prints `[bench]` lines and, last, one JSON line of
 * figures for the parent.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import v8 from 'node:v8';
import '@/app/_worker/handlers';
import '@/server/queue/worker';

const MB = 1024 * 1024;
const [shopId, jobId, photoCount, builds] = process.argv.slice(2);
const PAUSE_MS = Number(process.env.BENCH_PAUSE_MS ?? 0);

/** A field of /proc/self/status in bytes: VmRSS now, VmHWM the peak since the last reset. */
const status = (field: 'VmRSS' | 'VmHWM') =>
  Number(
    new RegExp(`${field}:\\s+(\\d+) kB`).exec(readFileSync('/proc/self/status', 'utf8'))?.[1],
  ) * 1024;
/** Resets the kernel's peak RSS to the current RSS (Linux). */
const resetPeak = () => writeFileSync('/proc/self/clear_refs', '5');

async function main() {
  // The worker's modules are loaded (static imports above); this is the process a job finds.
  const baseline = status('VmRSS');
  const { renderJobReport } = await import('@/features/reports/server/render-report');
  const { closeDb } = await import('@/db');

  const build = async () => {
    const before = status('VmRSS');
    resetPeak();
    const cpuBefore = process.cpuUsage();
    const started = performance.now();
    const { pdf } = await renderJobReport(shopId!, jobId!);
    const ms = performance.now() - started;
    const cpu = process.cpuUsage(cpuBefore);
    // Every photo must be in the PDF: a build that left them out would measure nothing.
    const images = pdf.toString('latin1').split('/Subtype /Image').length - 1;
    if (images !== Number(photoCount))
      throw new Error(`the PDF holds ${images} of ${photoCount} photos`);
    return {
      ms,
      // The whole process's CPU, the image library's threads included: steadier than wall time.
      cpuMs: (cpu.user + cpu.system) / 1000,
      pages: pdf.toString('latin1').match(/\/Type \/Page\b/g)?.length ?? 0,
      kb: pdf.byteLength / 1024,
      before,
      peak: status('VmHWM'),
      heap: v8.getHeapStatistics().total_heap_size,
    };
  };

  const line = (label: string, r: Awaited<ReturnType<typeof build>>) =>
    console.log(
      `[bench] ${label}: ${r.ms.toFixed(0)} ms (CPU ${r.cpuMs.toFixed(0)} ms), ${r.pages} pages, ${r.kb.toFixed(0)} kB, peak RSS ${(r.peak / MB).toFixed(0)} MB (${(r.before / MB).toFixed(0)} MB before), V8 heap ${(r.heap / MB).toFixed(0)} MB`,
    );
  console.log(
    `[bench] worker-shaped process ${process.pid} (MALLOC_ARENA_MAX=${process.env.MALLOC_ARENA_MAX ?? 'unset'}): RSS ${(baseline / MB).toFixed(0)} MB with the worker's modules loaded, before any build`,
  );
  const first = await build();
  line('first build (report modules loaded, fonts parsed)', first);
  const runs = [];
  for (let i = 0; i < Number(builds); i++) {
    const r = await build();
    runs.push(r);
    line(`build ${i + 1}`, r);
    // BENCH_PAUSE_MS: a worker idle between e-mails, where V8's memory reducer collects and
    // shrinks the heap; by default the builds run back to back (a burst of sign-offs, the worst case).
    if (PAUSE_MS > 0) await new Promise((done) => setTimeout(done, PAUSE_MS));
  }
  await closeDb();
  process.stdout.write(
    `${JSON.stringify({ baseline, first, runs, end: status('VmRSS'), arenaMax: process.env.MALLOC_ARENA_MAX ?? null, pauseMs: PAUSE_MS })}\n`,
  );
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
