/**
 * What bench:pages counts as a route's first-load JavaScript: the scripts a phone downloads before
 * the page can be used, in gzip bytes of the body on the wire (Resource Timing's encodedBodySize;
 * response headers are not JavaScript). "Before it can be used" = the request started before React
 * had hydrated the page's <main>: the document's scripts, their preloads, and the chunks of lazily
 * loaded parts the page shows at once (rendered on the server, so their chunks are preloaded and
 * hydration waits for them). Requested later, until the network is idle, and printed apart: what
 * the page loads after its first paint (the runner's sender) and the chunks named by Link
 * prefetches of other routes. Never requested, so never counted: `noModule` polyfills (Chromium
 * runs modules) and source maps (fetched only with DevTools open; production builds have none).
 */
import type { Page } from 'playwright-core';

/** Marks the moment <main> (else the body's first element) has its React props: hydrated. */
export const MARK_HYDRATION = `(() => {
  window.__hydratedAt = null;
  const look = () => {
    const el = document.querySelector('main') ?? document.body?.firstElementChild;
    if (el && Object.keys(el).some((k) => k.startsWith('__reactProps$'))) {
      window.__hydratedAt = performance.now();
    } else requestAnimationFrame(look);
  };
  requestAnimationFrame(look);
})();`;

export type Script = { url: string; gzipBytes: number; startMs: number; first: boolean };
export type Scripts = { hydratedMs: number | null; scripts: Script[] };

/** The page's scripts so far (each address once, its first request), split at hydration. */
export async function scriptsOf(page: Page): Promise<Scripts> {
  const { hydratedAt, entries } = await page.evaluate(() => ({
    hydratedAt: (window as unknown as { __hydratedAt: number | null }).__hydratedAt,
    entries: (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).map((e) => ({
      url: e.name,
      gzipBytes: e.encodedBodySize,
      startMs: e.startTime,
    })),
  }));
  const seen = new Set<string>();
  const scripts: Script[] = [];
  for (const e of entries.sort((a, b) => a.startMs - b.startMs)) {
    if (!/\.m?js$/.test(new URL(e.url).pathname) || seen.has(e.url)) continue;
    seen.add(e.url);
    // Not hydrated by the time the network went idle: count everything (and say so).
    scripts.push({ ...e, first: hydratedAt === null || e.startMs <= hydratedAt });
  }
  return { hydratedMs: hydratedAt, scripts };
}

export const kb = (scripts: Script[]) => scripts.reduce((sum, s) => sum + s.gzipBytes, 0) / 1024;
