/**
 * The runner's tap, for `npm run bench:pages`: a technician at the torque passes of a 24-bolt ring
 * taps "Clicked — bolt N"; each tap is measured until the next bolt is drawn highlighted (the big
 * button then names it). The last tap of a pass opens the next pass's setting card instead, so it
 * is tapped but not counted; "Wrench set" is tapped between passes.
 */
import type { Page } from 'playwright-core';
import { collect, gone, observeTaps, tapOnce, type TapRun, type TapStart } from './tap-timing';

const BLUE = {
  label: 'Blue click 20–200 in-lb',
  kind: 'click',
  min: 20,
  max: 200,
  unit: 'lbf-in',
  graduation: 1,
};

/** What DevTools' Performance panel records: tasks, style, layout, paint and the frames. */
const TRACE = [
  'devtools.timeline',
  'disabled-by-default-devtools.timeline',
  'disabled-by-default-devtools.timeline.frame',
  'disabled-by-default-devtools.timeline.invalidationTracking',
  'blink.user_timing',
  'v8.execute',
  'latencyInfo',
  'toplevel',
];

type Call = <T>(path: string, data: unknown) => Promise<T>;

/** A wrench verified today near each pass's setting of a 12 ft-lb spec (43, 101, 144 in-lb). */
export async function stockWrench(call: Call) {
  const calibrationDueOn = new Date(Date.now() + 200 * 86_400_000).toISOString().slice(0, 10);
  const wrench = await call<{ id: string }>('/api/wrenches', { ...BLUE, calibrationDueOn });
  for (const referenceValue of [43, 101, 144])
    await call(`/api/wrenches/${wrench.id}/verifications`, {
      referenceValue,
      readingValue: referenceValue,
      unit: 'lbf-in',
    });
}

/** From the runner's first step to the first bolt of pass 1 (not measured). */
export async function reachTorquePass(page: Page, runnerUrl: string) {
  await page.goto(runnerUrl);
  for (const heading of [
    /Safety gate/,
    /Clean/,
    /Inspect rim/,
    /Mount the tire/,
    /Index the ring/,
  ]) {
    await page.getByRole('heading', { name: heading }).waitFor();
    for (const box of await page.locator('main input[type=checkbox]').all()) await box.check();
    await page.getByRole('button', { name: 'Step done' }).click();
  }
  const start = page.getByRole('button', { name: /^Bolt \d+ started by hand$/ });
  await start.first().waitFor();
  while (await start.count()) await start.first().click();
  await page.getByRole('button', { name: 'All bolts started — step done' }).click();
}

/**
 * `taps` measured confirmations (plus the passes' last bolts, tapped and not counted);
 * `beforeEach` runs before each measured one (the floor's tap).
 */
export async function runnerTaps(
  page: Page,
  taps: number,
  boltCount: number,
  beforeEach: () => Promise<void>,
): Promise<TapRun> {
  const confirm = page.getByRole('button', { name: /^Clicked — bolt \d+$/ });
  const wrenchSet = page.getByRole('button', { name: 'Wrench set' });
  await wrenchSet.or(confirm).first().waitFor();
  await observeTaps(page);
  // BENCH_TAP_TRACE=<file>: a Chrome trace of the taps (style, layout, paint and scripts per frame,
  // which a CPU profile does not show); like the profile, for finding costs, not for figures.
  const trace = process.env.BENCH_TAP_TRACE;
  const browser = page.context().browser();
  if (trace && browser) await browser.startTracing(page, { path: trace, categories: TRACE });
  const lastAt = { at: 0 };
  const starts: TapStart[] = [];
  while (starts.filter((s) => s.measured).length < taps) {
    await wrenchSet.or(confirm).first().waitFor();
    if (await wrenchSet.count()) {
      await wrenchSet.click();
      continue;
    }
    const name = (await confirm.textContent()) ?? '';
    const counter = await page.getByText(/^\d+ of \d+ bolts/).textContent();
    const lastOfPass = Number(/^(\d+)/.exec(counter ?? '')?.[1]) === boltCount - 1;
    if (!lastOfPass) await beforeEach();
    const at = await tapOnce(page, confirm, () => gone(page, name), lastAt);
    starts.push({ at, measured: !lastOfPass });
  }
  if (trace && browser) await browser.stopTracing();
  return collect(page, starts);
}
