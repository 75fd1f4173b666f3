/**
 * The tap lab: the runner's tap without a server, for finding where a tap's time goes. Bundles
 * the real Runner (page.tsx) with esbuild in React's production build, with its names kept so a
 * CPU profile reads, and the app's CSS and font from the last e2e build (.next-e2e: run
 * bench:pages or the browser tests once first). Then Chromium at 4x CPU on a 360x640 phone: N
 * taps on "Clicked — bolt N", spaced past the double-tap guard, measured as bench:pages measures
 * them (Event Timing) and, from a Chrome trace, each tap's main-thread time in the thread's own
 * CPU time by kind (script, style, layout, prepaint, paint), which a busy machine does not stretch.
 *
 *   npx tsx tests/bench/tap-lab/run.ts [--taps 40] [--profile file.cpuprofile] [--trace file.json]
 */
import { mkdirSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import * as esbuild from 'esbuild';
import { chromium } from 'playwright-core';
import { ROOT } from '../../helpers/test-services';
import { collect, observeTaps, percentile, TAP_SPACING_MS, type TapStart } from '../tap-timing';
import { tapThreadTimes } from './trace-summary';

const arg = (name: string) => {
  const i = process.argv.indexOf(name);
  return i > 0 ? process.argv[i + 1] : undefined;
};
const TAPS = Number(arg('--taps') ?? 40);
const OUT = path.join(ROOT, '.data', 'tap-lab');
const BUILT = path.join(ROOT, '.next-e2e', 'static');
const TRACE = [
  'devtools.timeline',
  'disabled-by-default-devtools.timeline',
  'v8.execute',
  'toplevel',
];
const ORIGIN = 'http://localhost:7'; // a secure context (crypto.randomUUID), served by route()

async function bundle() {
  mkdirSync(OUT, { recursive: true });
  await esbuild.build({
    entryPoints: [path.join(import.meta.dirname, 'page.tsx')],
    bundle: true,
    outfile: path.join(OUT, 'app.js'),
    format: 'esm',
    jsx: 'automatic',
    target: 'es2022',
    minifySyntax: true,
    minifyWhitespace: true,
    define: { 'process.env.NODE_ENV': '"production"', 'process.env': '{}' },
    logLevel: 'warning',
  });
  const css = readdirSync(path.join(BUILT, 'chunks')).filter((f) => f.endsWith('.css'));
  if (!css.length) throw new Error('no CSS in .next-e2e: run `npm run bench:pages` once first');
  const styles = css.map((f) => readFileSync(path.join(BUILT, 'chunks', f), 'utf8')).join('\n');
  // next/font's class that defines --font-inter, as the root layout sets it on <html>.
  const fontClass = /\.([\w-]+_variable)\{--font-inter/.exec(styles)?.[1] ?? '';
  return { styles, fontClass };
}

async function main() {
  const { styles, fontClass } = await bundle();
  const html = `<!doctype html><html lang="en" class="${fontClass}"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1"><link rel="stylesheet" href="/app.css"></head>
<body><div id="root"></div><script type="module" src="/app.js"></script></body></html>`;
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-sync'],
  });
  const context = await browser.newContext({
    viewport: { width: 360, height: 640 },
    deviceScaleFactor: 3,
    isMobile: true,
    hasTouch: true,
  });
  const page = await context.newPage();
  await page.route(`${ORIGIN}/**`, (route) => {
    const url = new URL(route.request().url());
    if (url.pathname === '/') return route.fulfill({ contentType: 'text/html', body: html });
    if (url.pathname === '/app.css')
      return route.fulfill({ contentType: 'text/css', body: styles });
    if (url.pathname === '/app.js')
      return route.fulfill({
        contentType: 'text/javascript',
        body: readFileSync(path.join(OUT, 'app.js')),
      });
    if (url.pathname.startsWith('/_next/static/media/'))
      return route.fulfill({
        body: readFileSync(path.join(BUILT, 'media', path.basename(url.pathname))),
      });
    // Other phones' events, polled every 5 s: none.
    if (url.pathname.endsWith('/events'))
      return route.fulfill({ contentType: 'application/json', body: '{"data":{"events":[]}}' });
    return route.fulfill({ status: 404, body: '' });
  });
  page.on('pageerror', (e) => console.error('page error:', e.message));
  const cdp = await context.newCDPSession(page);
  await page.goto(`${ORIGIN}/`);
  await page.getByRole('button', { name: 'Wrench set' }).click();
  await page.getByRole('button', { name: /^Clicked — bolt \d+$/ }).waitFor();
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
  await observeTaps(page);
  const traceFile = arg('--trace') ?? path.join(OUT, 'taps-trace.json');
  await browser.startTracing(page, { path: traceFile, categories: TRACE });
  const profile = arg('--profile');
  if (profile) {
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.start');
  }
  const starts: TapStart[] = [];
  let last = 0;
  while (starts.filter((s) => s.measured).length < TAPS) {
    const wait = last + TAP_SPACING_MS - Date.now();
    if (wait > 0) await page.waitForTimeout(wait);
    // One plain look at the page per tap (no role queries on the page being measured).
    const next = await page.evaluate(FIND);
    await page.mouse.click(next.x, next.y);
    last = Date.now();
    if (next.wrenchSet) continue;
    await page.waitForFunction(
      (label) => ![...document.querySelectorAll('button')].some((b) => b.textContent === label),
      next.label,
      { polling: 50 },
    );
    starts.push({ at: next.at, measured: !next.lastOfPass });
  }
  if (profile) {
    const { writeFileSync } = await import('node:fs');
    writeFileSync(profile, JSON.stringify((await cdp.send('Profiler.stop')).profile));
  }
  const trace = JSON.parse(String(await browser.stopTracing())) as { traceEvents: never[] };
  const run = await collect(page, starts);
  await browser.close();
  const rows = tapThreadTimes(trace.traceEvents) ?? [];
  console.log(
    `Event Timing, ${run.durations.length} taps at 4x: p50 ${percentile(run.durations, 50)} ms  p95 ${percentile(run.durations, 95)} ms  drawn in the measured frame ${run.drawnInFrame}  long tasks ${run.longTasks.length}`,
  );
  console.log(`main-thread CPU per tap (ms, thread time, ${rows.length} taps incl. unmeasured):`);
  for (const kind of Object.keys(rows[0] ?? {}))
    console.log(
      `  ${kind.padEnd(9)} median ${percentile(
        rows.map((r) => r[kind]!),
        50,
      )
        .toFixed(2)
        .padStart(6)}  p90 ${percentile(
        rows.map((r) => r[kind]!),
        90,
      )
        .toFixed(2)
        .padStart(6)}`,
    );
}

/** In the page: the button to tap next and whether this tap ends a pass (not measured). */
const FIND = `(() => {
  const buttons = [...document.querySelectorAll('button')];
  const set = buttons.find((b) => b.textContent === 'Wrench set');
  const el = set ?? buttons.find((b) => /^Clicked — bolt \\d+$/.test(b.textContent ?? ''));
  if (!el) throw new Error('no button to tap');
  const count = [...document.querySelectorAll('p')].map((p) => /^(\\d+) of (\\d+) bolts/.exec(p.textContent ?? '')).find(Boolean);
  const r = el.getBoundingClientRect();
  return { wrenchSet: Boolean(set), label: el.textContent ?? '', x: r.x + r.width / 2, y: r.y + r.height / 2,
    lastOfPass: count ? Number(count[1]) === Number(count[2]) - 1 : false, at: performance.now() };
})()` as unknown as () => {
  wrenchSet: boolean;
  label: string;
  x: number;
  y: number;
  lastOfPass: boolean;
  at: number;
};

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
