import { createSerwistRoute } from '@serwist/turbopack';
import { runnerPrecacheOnly } from '@/features/runner/service-worker/precache-manifest';

// The runner's service worker (features/runner/service-worker/sw.ts), bundled by esbuild with the
// runner's precache manifest while `next build` prerenders this route: /runner-sw/sw.js. A public
// build file like any script, so no session check; unknown names are a 404 (dynamicParams false).
const serwist = createSerwistRoute({
  swSrc: 'features/runner/service-worker/sw.ts',
  useNativeEsbuild: true,
  // A classic script (module service workers are newer on phones); no source map served. The
  // build time makes each deploy's worker new to the phone, so its activation sweeps what the
  // previous build left there even when only server code changed.
  esbuildOptions: {
    format: 'iife',
    sourcemap: false,
    define: { __RUNNER_SW_BUILT_AT__: JSON.stringify(new Date().toISOString()) },
  },
  manifestTransforms: [runnerPrecacheOnly],
});

export const { dynamic, dynamicParams, revalidate, generateStaticParams } = serwist;

/** `no-cache`: the browser asks every time, so a deploy's new worker is found at once. */
export async function GET(...args: Parameters<typeof serwist.GET>) {
  const response = await serwist.GET(...args);
  response.headers.set('Cache-Control', 'no-cache');
  return response;
}
