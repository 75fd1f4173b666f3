import { existsSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  isKeepablePage,
  isRunnerNavigation,
  isRunnerPagePath,
  outdatedCaches,
  pageCopyKey,
  runnerPageFromMessage,
} from '@/features/runner/service-worker/routes';
import { RUNNER_PAGES_CACHE, RUNNER_PRECACHE } from '@/features/runner/service-worker/cache-names';

const origin = 'https://shop.example';
const runner = '/jobs/7f0c/wheels/91ab/run';
const navigate = (path: string, init: { method?: string; mode?: string } = {}) => ({
  method: init.method ?? 'GET',
  mode: init.mode ?? 'navigate',
  url: `${origin}${path}`,
});

describe('what the runner service worker answers', () => {
  it('a reload or typed address of a runner page, with or without a trailing slash or a query', () => {
    expect(isRunnerNavigation(navigate(runner), origin)).toBe(true);
    expect(isRunnerNavigation(navigate(`${runner}/`), origin)).toBe(true);
    expect(isRunnerNavigation(navigate(`${runner}?from=my-wheels`), origin)).toBe(true);
  });

  it('never an API call, a customer link, a photo, the sign-in page or any other page', () => {
    for (const path of [
      `/api/wheels/91ab/events`,
      '/api/photos/5d2e',
      '/api/uploadthing',
      '/r/3kq9x',
      '/r/3kq9x/report.pdf',
      '/sign-in',
      '/my-wheels',
      '/jobs/7f0c',
      '/jobs/7f0c/review',
      `${runner}/extra`,
      '/practice/attempts/a1',
    ])
      expect(isRunnerNavigation(navigate(path), origin), path).toBe(false);
  });

  it('never a server action (a POST to the runner page itself) or the router’s own fetch of it', () => {
    expect(isRunnerNavigation(navigate(runner, { method: 'POST' }), origin)).toBe(false);
    expect(isRunnerNavigation(navigate(`${runner}?_rsc=1x2`, { mode: 'cors' }), origin)).toBe(
      false,
    );
  });

  it('never another origin’s page at the same path', () => {
    expect(
      isRunnerNavigation({ ...navigate(runner), url: `https://evil.example${runner}` }, origin),
    ).toBe(false);
  });

  it('the runner route it matches is the app’s runner route', () => {
    expect(existsSync('app/(runner)/jobs/[jobId]/wheels/[wheelId]/run/page.tsx')).toBe(true);
    expect(isRunnerPagePath(runner)).toBe(true);
  });
});

describe('messages from the runner page', () => {
  it('keeps only a runner page the message names', () => {
    expect(runnerPageFromMessage({ type: 'cache-runner-page', page: runner })).toBe(runner);
    expect(runnerPageFromMessage({ type: 'cache-runner-page', page: '/api/wheels/1/events' })).toBe(
      null,
    );
    expect(runnerPageFromMessage({ type: 'cache-runner-page', page: '/r/3kq9x' })).toBe(null);
    expect(runnerPageFromMessage({ type: 'CACHE_URLS', page: runner })).toBe(null);
    expect(runnerPageFromMessage(null)).toBe(null);
    expect(runnerPageFromMessage('cache-runner-page')).toBe(null);
  });

  it('judges the address as the browser reads it, not as written', () => {
    const asked = (page: string) => runnerPageFromMessage({ type: 'cache-runner-page', page });
    expect(asked('/jobs/../wheels/../run')).toBe(null);
    expect(asked('/jobs/a/wheels/b?/run')).toBe(null);
    expect(asked('/jobs/a/wheels/b#/run')).toBe(null);
    expect(asked('//elsewhere.example/jobs/a/wheels/b/run')).toBe(null);
    expect(asked('jobs/a/wheels/b/run')).toBe(null);
    expect(asked('/jobs/x/../7f0c/wheels/91ab/run')).toBe(runner);
  });
});

describe('which responses are kept', () => {
  it('a complete page only: not an error page, nor the sign-in page a signed-out visit was sent to', () => {
    expect(isKeepablePage({ ok: true, redirected: false, type: 'basic' })).toBe(true);
    expect(isKeepablePage({ ok: false, redirected: false, type: 'basic' })).toBe(false);
    expect(isKeepablePage({ ok: true, redirected: true, type: 'basic' })).toBe(false);
    expect(isKeepablePage({ ok: false, redirected: false, type: 'opaque' })).toBe(false);
  });

  it('one copy per runner page, whatever its query string', () => {
    expect(pageCopyKey(`${origin}${runner}?from=board`)).toBe(`${origin}${runner}`);
  });
});

describe('caches removed when a new service worker takes over', () => {
  const precache = RUNNER_PRECACHE;
  it('the earlier design’s asset cache goes; the page copies and this build’s precache stay', () => {
    expect(
      outdatedCaches(
        ['ringpass-runner-assets-v1', RUNNER_PAGES_CACHE, precache, 'another-library-cache'],
        [precache, RUNNER_PAGES_CACHE],
      ),
    ).toEqual(['ringpass-runner-assets-v1']);
  });
});
