/**
 * `npm run bench:pages`: for each route, the JavaScript the browser downloads before the page can
 * be used (gzip bytes on the wire; what counts: first-load.ts), what it loads after that until the
 * network is idle (printed apart), and the Largest Contentful Paint under mobile emulation
 * (360×640, 4× CPU slowdown, 150 ms RTT / 1.6 Mbps like Lighthouse's mobile profile). Then the
 * runner's tap (tap-timing.ts): 48 taps on "Clicked — bolt N" against 48 on a page holding one
 * button, both at 4× CPU slowdown, taken in turn (a floor tap, a runner tap) so both see the same
 * load; the last line is the ratio of their p95s.
 * Serves the production build through tests/e2e/serve.ts (own database and mail sink, port 3100).
 */
import { spawn } from 'node:child_process';
import { mkdirSync, openSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { chromium, type CDPSession, type Page } from 'playwright-core';
import { E2E, ROOT } from '../helpers/test-services';
import { waitForMail } from '../helpers/mailbox';
import { kb, MARK_HYDRATION, scriptsOf } from './first-load';
import { reachTorquePass, runnerTaps, stockWrench } from './runner-taps';
import { openFloor, percentile, tapLine } from './tap-timing';

const BASE = `http://127.0.0.1:${E2E.appPort}`;
const PHONE = {
  viewport: { width: 360, height: 640 },
  deviceScaleFactor: 3,
  isMobile: true,
  hasTouch: true,
};
const TAPS = 48;
const RING = 24;
const ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

async function waitForServer(url: string, seconds: number) {
  for (let i = 0; i < seconds * 2; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {}
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`server at ${url} did not come up`);
}

async function measure(page: Page, cdp: CDPSession, path: string) {
  await cdp.send('Network.clearBrowserCache');
  await page.goto(BASE + path, { waitUntil: 'networkidle' });
  const lcp = await page.evaluate(
    () =>
      new Promise<number>((resolve) => {
        new PerformanceObserver((list) => {
          const entries = list.getEntries();
          resolve(entries[entries.length - 1]!.startTime);
        }).observe({ type: 'largest-contentful-paint', buffered: true });
        setTimeout(() => resolve(NaN), 3000);
      }),
  );
  const { hydratedMs, scripts } = await scriptsOf(page);
  const first = scripts.filter((s) => s.first);
  const later = scripts.filter((s) => !s.first);
  // BENCH_SCRIPTS=1: each script, its gzip size and when it was asked for.
  if (process.env.BENCH_SCRIPTS) {
    console.log(`${path}: hydrated at ${hydratedMs?.toFixed(0) ?? 'never (all counted)'} ms`);
    for (const s of scripts)
      console.log(
        `  ${s.first ? 'first' : 'later'} ${(s.gzipBytes / 1024).toFixed(1).padStart(6)} kB at ${s.startMs.toFixed(0).padStart(5)} ms  ${new URL(s.url).pathname}`,
      );
  }
  return {
    path,
    scripts: first.length,
    jsKb: kb(first),
    laterKb: kb(later),
    later: later.length,
    lcpMs: lcp,
  };
}

async function main() {
  // The build's and server's output, for when the server does not come up.
  mkdirSync(path.join(ROOT, '.data'), { recursive: true });
  const log = path.join(ROOT, '.data', 'bench-pages-serve.log');
  const server = spawn(
    'node_modules/.bin/tsx',
    ['--conditions=react-server', 'tests/e2e/serve.ts'],
    { cwd: ROOT, stdio: ['ignore', openSync(log, 'w'), 'inherit'], detached: true },
  );
  try {
    // A build on two cores shared with others' builds can take minutes.
    await waitForServer(`${BASE}/sign-in`, 900).catch((error: unknown) => {
      throw new Error(`${String(error)} (see ${log})`);
    });
    const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ARGS });
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.addInitScript(MARK_HYDRATION);
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 150,
      downloadThroughput: (1.6 * 1024 * 1024) / 8,
      uploadThroughput: (750 * 1024) / 8,
    });

    const rows = [await measure(page, cdp, '/sign-in'), await measure(page, cdp, '/sign-up')];
    // Sign up a shop to measure the signed-in pages.
    await page.getByLabel('Shop name').fill('Bench Shop');
    await page.getByLabel('Your name').fill('Bench Lead');
    const email = `bench-${Date.now()}@bench.test`;
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('benchmark password');
    await page.getByRole('button', { name: 'Create shop' }).click();
    // Sign-up finishes through the link in the e-mail.
    const link = /\/sign-up\/[A-Za-z0-9_-]+/.exec(
      (await waitForMail(E2E.sink.dir, email, 60_000)).text,
    )?.[0];
    await page.goto(BASE + link);
    await page.getByRole('button', { name: 'Create Bench Shop and sign in' }).click();
    await page.waitForURL(`${BASE}/board`, { timeout: 60_000 });
    for (const path of ['/board', '/team', '/mailbox']) rows.push(await measure(page, cdp, path));
    // A job with one wheel, to measure the runner (the page a technician keeps open all day).
    const call = async <T>(path: string, data: unknown) =>
      (
        (await (
          await page.request.post(BASE + path, { data, headers: { origin: BASE } })
        ).json()) as { data: T }
      ).data;
    await stockWrench(call);
    const spec = await call<{ id: string }>('/api/specs', {
      name: `Bench ${RING}`,
      boltCount: RING,
      boltThread: 'M8',
      finalTorque: 12,
      torqueUnit: 'lbf-ft',
      passPercents: [30, 70, 100],
      patternKind: 'cross',
      checkPass: true,
      maxBeadSeatPressure: 30,
      runningPressure: 14,
      pressureUnit: 'psi',
    });
    const me = (
      (await (await page.request.get(BASE + '/api/team/members')).json()) as {
        data: { id: string }[];
      }
    ).data[0]!;
    const job = await call<{ id: string; wheels: { id: string }[] }>('/api/jobs', {
      customer: { name: 'Bench', phone: '', email: '' },
      vehicle: { make: 'Bench' },
      wheels: [
        {
          position: 'LF',
          specId: spec.id,
          tireSize: '30x10R14',
          targetPressure: 14,
          pressureUnit: 'psi',
        },
      ],
      assigneeId: me.id,
    });
    rows.push(await measure(page, cdp, `/jobs/${job.id}`));
    const runnerPath = `/jobs/${job.id}/wheels/${job.wheels[0]!.id}/run`;
    const runner = await measure(page, cdp, runnerPath);
    rows.push({ ...runner, path: '/…/run (runner)' });

    // Taps: the runner reached at full speed, then tapped at 4×, a floor tap before each.
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    await reachTorquePass(page, BASE + runnerPath);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    // The floor in a second browser: a page that is not in front paints no frames to measure.
    const floorBrowser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ARGS });
    const floorPage = await floorBrowser.newPage(PHONE);
    await (
      await floorPage.context().newCDPSession(floorPage)
    ).send('Emulation.setCPUThrottlingRate', { rate: 4 });
    const floorTaps = await openFloor(floorPage);
    // BENCH_TAP_PROFILE=<file>: a CPU profile of the runner's page over the taps (the sampling
    // slows them: figures from such a run are for finding where the time goes, not for reporting).
    const profile = process.env.BENCH_TAP_PROFILE;
    if (profile) await cdp.send('Profiler.enable');
    if (profile) await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
    if (profile) await cdp.send('Profiler.start');
    const taps = await runnerTaps(page, TAPS, RING, floorTaps.tap);
    if (profile) writeFileSync(profile, JSON.stringify((await cdp.send('Profiler.stop')).profile));
    const floor = await floorTaps.result();
    await floorBrowser.close();
    await browser.close();

    console.log(
      'route             scripts   first-load JS gzip kB   later (scripts, kB)   LCP ms (mobile, 4x CPU, 150 ms RTT)',
    );
    for (const r of rows) {
      console.log(
        `${r.path.slice(0, 16).padEnd(17)} ${String(r.scripts).padStart(7)} ${r.jsKb.toFixed(1).padStart(23)} ${`${r.later}, ${r.laterKb.toFixed(1)}`.padStart(21)}   ${Number.isNaN(r.lcpMs) ? '   n/a' : r.lcpMs.toFixed(0).padStart(6)}`,
      );
    }
    console.log(
      `\nTap to next paint (Event Timing, 4x CPU, ${RING}-bolt ring), ${TAPS} taps each:`,
    );
    console.log(tapLine('runner', taps));
    console.log(tapLine('floor', floor));
    const ratio = percentile(taps.durations, 95) / percentile(floor.durations, 95);
    console.log(
      `taps p95 runner/floor ${ratio.toFixed(2)} (target ≤ 1.25); p50 ${(percentile(taps.durations, 50) / percentile(floor.durations, 50)).toFixed(2)}`,
    );
  } finally {
    process.kill(-server.pid!, 'SIGTERM');
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
