/**
 * Which of the build's files the runner page runs on, read from Next's own build output (pure:
 * the caller hands in a reader of `distDir` files). Starts from the route's manifests (the
 * framework's first scripts, its client components' chunks and styles, its font) and follows every
 * chunk a chunk names: that is how Turbopack's output asks for the chunks `next/dynamic` loads
 * later (`"static/chunks/….js"` in the importing chunk), so those are precached too.
 */

/** The runner route's folder inside `distDir` (app/(runner)/jobs/[jobId]/wheels/[wheelId]/run). */
export const RUNNER_ROUTE_OUTPUT = 'server/app/(runner)/jobs/[jobId]/wheels/[wheelId]/run';

const BUILD_FILE = /static\/(?:chunks|media)\/[\w.-]+\.(?:js|css|woff2?|svg|png|jpg|webp)/g;

type RouteBuildManifest = { polyfillFiles?: string[]; rootMainFiles?: string[] };
type FontManifest = { app?: Record<string, string[]> };

/**
 * Paths relative to `distDir` (`static/chunks/….js`), or null when the route's manifests are not
 * where this version of Next writes them (the caller then keeps the whole build: never too little).
 */
export function runnerFiles(read: (pathInDistDir: string) => string | null): Set<string> | null {
  const buildManifest = read(`${RUNNER_ROUTE_OUTPUT}/page/build-manifest.json`);
  const clientManifest = read(`${RUNNER_ROUTE_OUTPUT}/page_client-reference-manifest.js`);
  if (buildManifest === null || clientManifest === null) return null;

  const { polyfillFiles = [], rootMainFiles = [] } = JSON.parse(
    buildManifest,
  ) as RouteBuildManifest;
  const fonts = read(`${RUNNER_ROUTE_OUTPUT}/page/next-font-manifest.json`);
  const fontFiles = Object.values((fonts ? (JSON.parse(fonts) as FontManifest) : {}).app ?? {});
  const toVisit = [
    ...polyfillFiles,
    ...rootMainFiles,
    ...fontFiles.flat(),
    ...(clientManifest.match(BUILD_FILE) ?? []),
  ];

  const found = new Set<string>();
  for (let file = toVisit.pop(); file !== undefined; file = toVisit.pop()) {
    if (found.has(file)) continue;
    const text = read(file);
    if (text === null) continue;
    found.add(file);
    if (/\.(?:js|css)$/.test(file)) toVisit.push(...(text.match(BUILD_FILE) ?? []));
  }
  return found;
}
