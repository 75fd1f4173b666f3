import { describe, expect, it } from 'vitest';
import { buildCodeIn, pageCopyStillWorks } from '@/features/runner/service-worker/page-copies';

// The shape of a runner page as Next renders it: a stylesheet and font link, the framework's
// scripts, and a client component's chunk named inside the inline RSC payload (escaped quotes).
const page = (chunk: string) =>
  [
    '<!DOCTYPE html><html><head>',
    '<link rel="stylesheet" href="/_next/static/chunks/2f-xx.css" data-precedence="next"/>',
    '<link rel="preload" href="/_next/static/media/inter_latin.woff2" as="font" crossorigin=""/>',
    '<script src="/_next/static/chunks/turbopack-07.js" async=""></script>',
    '<script src="/_next/static/chunks/0cz1.js" noModule=""></script></head><body>',
    `<script>self.__next_f.push([1,"4:I[339756,[\\"/_next/static/chunks/${chunk}.js\\"],\\"default\\"]"])</script>`,
    '</body></html>',
  ].join('');

const precached = new Set([
  '/_next/static/chunks/2f-xx.css',
  '/_next/static/chunks/turbopack-07.js',
  '/_next/static/chunks/0cz1.js',
  '/_next/static/chunks/421c.js',
]);

describe('page copies after a deploy', () => {
  it('reads every script and style a page names, in its tags and in its RSC payload', () => {
    expect(buildCodeIn(page('421c')).sort()).toEqual([...precached].sort());
  });

  it('a copy whose scripts the new precache holds is kept (a missing font does not count)', () => {
    expect(pageCopyStillWorks(page('421c'), precached)).toBe(true);
  });

  it('a copy rendered by the previous build (a chunk the new build no longer has) is dropped', () => {
    expect(pageCopyStillWorks(page('old9'), precached)).toBe(false);
  });

  it('something that is not a page of the build (no scripts at all) is dropped', () => {
    expect(pageCopyStillWorks('<html><body>Sign in</body></html>', precached)).toBe(false);
  });
});
