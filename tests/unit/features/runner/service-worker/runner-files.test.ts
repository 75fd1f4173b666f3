import { describe, expect, it } from 'vitest';
import { RUNNER_ROUTE_OUTPUT, runnerFiles } from '@/features/runner/service-worker/runner-files';

/** A build's output as Next 16 with Turbopack writes it, reduced to what the reader looks at. */
const build: Record<string, string> = {
  [`${RUNNER_ROUTE_OUTPUT}/page/build-manifest.json`]: JSON.stringify({
    polyfillFiles: ['static/chunks/poly.js'],
    rootMainFiles: ['static/chunks/main.js', 'static/chunks/turbopack-rt.js'],
  }),
  [`${RUNNER_ROUTE_OUTPUT}/page/next-font-manifest.json`]: JSON.stringify({
    app: { '[project]/app/(runner)/…/page': ['static/media/inter.woff2'] },
  }),
  [`${RUNNER_ROUTE_OUTPUT}/page_client-reference-manifest.js`]:
    'globalThis.__RSC_MANIFEST["/(runner)/…/page"] = {"clientModules":{"runner.tsx":{"chunks":["/_next/static/chunks/runner.js"]}},"entryCSSFiles":{"x":[{"path":"static/chunks/app.css"}]}}',
  'static/chunks/poly.js': '',
  'static/chunks/main.js': '',
  'static/chunks/turbopack-rt.js': '',
  'static/media/inter.woff2': 'wOF2',
  // The runner's chunk loads the photo step later (next/dynamic), which loads its own chunk.
  'static/chunks/runner.js':
    'e.v(t=>Promise.all(["static/chunks/photo-step.js"].map(t=>e.l(t))).then(()=>t(6817)))',
  'static/chunks/photo-step.js': 'Promise.all(["static/chunks/uploader.js"].map(t=>e.l(t)))',
  'static/chunks/uploader.js': '',
  'static/chunks/app.css': '@font-face{src:url(/_next/static/media/inter.woff2)}',
  // Another page's chunk: not the runner's.
  'static/chunks/board.js': '',
};
const read = (file: string) => build[file] ?? null;

describe('the files the runner page runs on', () => {
  it('its first scripts, styles and font, and the chunks next/dynamic loads later (nested too)', () => {
    expect([...runnerFiles(read)!].sort()).toEqual(
      [
        'static/chunks/app.css',
        'static/chunks/main.js',
        'static/chunks/photo-step.js',
        'static/chunks/poly.js',
        'static/chunks/runner.js',
        'static/chunks/turbopack-rt.js',
        'static/chunks/uploader.js',
        'static/media/inter.woff2',
      ].sort(),
    );
  });

  it('no other page’s chunks', () => {
    expect(runnerFiles(read)!.has('static/chunks/board.js')).toBe(false);
  });

  it('unknown when the route’s manifests are not where they were (the whole build is kept then)', () => {
    expect(runnerFiles(() => null)).toBe(null);
  });
});
