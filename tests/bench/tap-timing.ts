/**
 * Tap latency as INP counts it, for `npm run bench:pages`: each tap is real input (CDP mouse
 * events at the button's centre), and its duration is the Event Timing API's: every event entry of the
 * interaction (pointerdown, pointerup, click…) grouped by `interactionId`, the longest one taken,
 * which runs from the input to the next paint after the handlers. Long tasks during the taps are
 * collected beside them.
 */
import type { Locator, Page } from 'playwright-core';
import { DOUBLE_TAP_MS } from '../../features/runner/double-tap';

/** Past the runner's double-tap guard (it drops a second tap within DOUBLE_TAP_MS). */
export const TAP_SPACING_MS = DOUBLE_TAP_MS + 100;

export type TapRun = {
  /** One duration per measured tap (ms, Event Timing's 8 ms granularity). */
  durations: number[];
  longTasks: number[];
  /** Of the taps with an entry (≥ 16 ms), those whose DOM change came before the paint their duration ends at. */
  drawnInFrame: number;
  /** Taps with no entry at all: every event under 16 ms (counted as 16 ms). */
  underThreshold: number;
};

type Collected = {
  events: { id: number; start: number; duration: number; processingEnd: number }[];
  longTasks: { start: number; duration: number }[];
  mutations: number[];
};

/** Starts the observers in the page; entries are kept on `window` until `collect`. */
export async function observeTaps(page: Page) {
  await page.evaluate(() => {
    const w = window as unknown as { __taps: Collected };
    w.__taps = { events: [], longTasks: [], mutations: [] };
    new PerformanceObserver((list) => {
      // interactionId is in the Event Timing spec and Chromium, not in TypeScript 5.9's DOM types.
      for (const e of list.getEntries() as (PerformanceEventTiming & { interactionId: number })[]) {
        if (e.interactionId)
          w.__taps.events.push({
            id: e.interactionId,
            start: e.startTime,
            duration: e.duration,
            processingEnd: e.processingEnd,
          });
      }
      // durationThreshold is part of the Event Timing spec but not of TypeScript's DOM types yet.
    }).observe({ type: 'event', durationThreshold: 16, buffered: true } as PerformanceObserverInit);
    new PerformanceObserver((list) => {
      for (const e of list.getEntries())
        w.__taps.longTasks.push({ start: e.startTime, duration: e.duration });
    }).observe({ type: 'longtask', buffered: true });
    // When the screen's DOM changed: a tap's change must land before the paint that ends its entry.
    new MutationObserver(() => w.__taps.mutations.push(performance.now())).observe(document.body, {
      subtree: true,
      childList: true,
      characterData: true,
      attributes: true,
    });
  });
}

/**
 * One measured tap: clicks `button` once the spacing since the last tap has passed, then waits
 * until `changed` says the screen shows the tap's result. Returns when the tap began (page clock).
 */
export async function tapOnce(
  page: Page,
  button: Locator,
  changed: () => Promise<void>,
  lastAt: { at: number },
): Promise<number> {
  const wait = lastAt.at + TAP_SPACING_MS - Date.now();
  if (wait > 0) await page.waitForTimeout(wait);
  await button.waitFor();
  const start = await page.evaluate(() => performance.now());
  // Real input at the button's centre, as a finger lands: Playwright's own click would also run
  // its hit-target check inside the page on pointerdown (a forced style and layout, then a hit
  // test), inside the very interaction being measured, and at a cost that grows with the page.
  const box = await button.boundingBox();
  if (!box) throw new Error('the button to tap is not on screen');
  await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
  lastAt.at = Date.now();
  await changed();
  return start;
}

/**
 * Waits until no button says `label` any more. A plain check every 50 ms: Playwright's own
 * locators poll on every animation frame with accessibility queries, which on the runner's page
 * cost more main-thread time than the tap being measured.
 */
export async function gone(page: Page, label: string) {
  await page.waitForFunction(
    (text) => ![...document.querySelectorAll('button')].some((b) => b.textContent === text),
    label,
    { polling: 50, timeout: 30_000 },
  );
}

/** When each tap began (page clock); a tap not `measured` only bounds the one before it. */
export type TapStart = { at: number; measured: boolean };

/** Durations of the measured taps' interactions; one per measured tap. */
export async function collect(page: Page, taps: TapStart[]): Promise<TapRun> {
  await page.waitForTimeout(1000); // the last entries are reported after their frame
  const c = await page.evaluate(() => (window as unknown as { __taps: Collected }).__taps);
  const byId = new Map<number, { start: number; duration: number; processingEnd: number }>();
  for (const e of c.events) {
    const had = byId.get(e.id);
    byId.set(e.id, {
      start: Math.min(had?.start ?? Infinity, e.start),
      duration: Math.max(had?.duration ?? 0, e.duration),
      processingEnd: Math.max(had?.processingEnd ?? 0, e.processingEnd),
    });
  }
  const interactions = [...byId.values()];
  let drawnInFrame = 0;
  let underThreshold = 0;
  const durations = taps.flatMap(({ at: from, measured }, i) => {
    if (!measured) return [];
    const to = taps[i + 1]?.at ?? Infinity;
    const found = interactions.filter((x) => x.start >= from && x.start < to);
    // No entry at all: every event of the tap took under the 16 ms threshold.
    if (!found.length) {
      underThreshold++;
      return [16];
    }
    const first = found.reduce((a, b) => (a.start <= b.start ? a : b));
    if (c.mutations.some((m) => m >= first.start && m <= first.start + first.duration))
      drawnInFrame++;
    return [Math.max(...found.map((x) => x.duration))];
  });
  const from = taps[0]?.at ?? 0;
  const longTasks = c.longTasks
    .filter((t) => t.start >= from && t.start < (taps.at(-1)?.at ?? 0) + TAP_SPACING_MS)
    .map((t) => t.duration);
  return { durations, longTasks, drawnInFrame, underThreshold };
}

export function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

/** A page holding one button that changes its own label: the browser's own floor for a tap. */
export const FLOOR_HTML = `<!doctype html><html><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1"><title>Tap floor</title></head>
<body style="margin:0;padding:16px;font-family:sans-serif">
<button id="tap" type="button" style="width:100%;min-height:80px;font-size:24px;font-weight:800">Tapped 0</button>
<script>let n = 0; const b = document.getElementById('tap'); b.onclick = () => { b.textContent = 'Tapped ' + ++n; };</script>
</body></html>`;

/**
 * The floor page, tapped one tap at a time: the bench takes a floor tap before each runner tap,
 * so both see the same load from whatever else this machine is doing.
 */
export async function openFloor(page: Page, url = 'http://tap-floor.test/') {
  await page.route(url, (route) =>
    route.fulfill({ status: 200, contentType: 'text/html', body: FLOOR_HTML }),
  );
  await page.goto(url);
  await observeTaps(page);
  const button = page.locator('#tap');
  const lastAt = { at: 0 };
  const starts: TapStart[] = [];
  return {
    tap: async () => {
      const n = starts.length + 1;
      const at = await tapOnce(page, button, () => gone(page, `Tapped ${n - 1}`), lastAt);
      starts.push({ at, measured: true });
    },
    result: () => collect(page, starts),
  };
}

export function tapLine(name: string, run: TapRun): string {
  const p50 = percentile(run.durations, 50);
  const p95 = percentile(run.durations, 95);
  const long = run.longTasks.length
    ? `${run.longTasks.length} (${run.longTasks.map((d) => d.toFixed(0)).join(', ')} ms)`
    : '0';
  return `${name.padEnd(8)} taps ${run.durations.length}  p50 ${p50.toFixed(0)} ms  p95 ${p95.toFixed(0)} ms  max ${Math.max(...run.durations).toFixed(0)} ms  drawn in the measured frame ${run.drawnInFrame}/${run.durations.length - run.underThreshold} (under 16 ms: ${run.underThreshold})  long tasks ${long}`;
}
