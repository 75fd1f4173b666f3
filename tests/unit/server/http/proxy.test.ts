import { unstable_doesMiddlewareMatch } from 'next/experimental/testing/server';
import { NextRequest } from 'next/server';
import { afterEach, describe, expect, it, vi } from 'vitest';

// proxy.ts reads the validated env once per module load, so each case loads it afresh.
async function proxyWith(appUrl: string) {
  vi.resetModules();
  vi.stubEnv('NODE_ENV', 'production');
  vi.stubEnv('DATABASE_URL', 'postgres://nobody@127.0.0.1:1/none');
  vi.stubEnv('SMTP_URL', 'smtp://127.0.0.1:2525');
  vi.stubEnv('APP_URL', appUrl);
  vi.stubEnv('UPLOADTHING_INGEST_URL', 'http://127.0.0.1:2531');
  vi.stubEnv('UPLOADTHING_UFS_HOST', 'localhost:2531');
  return (await import('@/proxy')).proxy;
}

afterEach(() => vi.unstubAllEnvs());

describe('proxy: per-response security headers', () => {
  it('gives the page and Next the same fresh nonce, and no HSTS over plain http', async () => {
    const proxy = await proxyWith('http://127.0.0.1:3000');
    const response = proxy(new NextRequest('http://127.0.0.1:3000/board'));
    const csp = response.headers.get('content-security-policy') ?? '';
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce).toBeTruthy();
    // Next reads the nonce from the request's CSP header, which the proxy forwards.
    expect(response.headers.get('x-middleware-request-content-security-policy')).toBe(csp);
    expect(response.headers.get('x-middleware-request-x-nonce')).toBe(nonce);
    expect(csp).toContain('http://127.0.0.1:2531');
    expect(response.headers.get('strict-transport-security')).toBeNull();
    const again = proxy(new NextRequest('http://127.0.0.1:3000/board')).headers.get(
      'content-security-policy',
    );
    expect(again).not.toBe(csp);
  });

  it('sends HSTS when the app is served over https', async () => {
    const proxy = await proxyWith('https://ringpass.example.com');
    const response = proxy(new NextRequest('https://ringpass.example.com/board'));
    expect(response.headers.get('strict-transport-security')).toBe('max-age=63072000');
    expect(response.headers.get('content-security-policy')).toContain('upgrade-insecure-requests');
  });
});

describe('proxy: which requests it runs on', () => {
  const runsOn = async (url: string, headers: Record<string, string> = {}) => {
    const { config } = await import('@/proxy');
    return unstable_doesMiddlewareMatch({ config, url, headers });
  };

  it('every page, and a form posted without JavaScript (an HTML answer that needs its nonce)', async () => {
    expect(await runsOn('/board')).toBe(true);
    expect(await runsOn('/jobs/j1/wheels/w1/run')).toBe(true);
    expect(await runsOn('/sign-in', { 'content-type': 'multipart/form-data; boundary=x' })).toBe(
      true,
    );
  });

  it("every answer that can be HTML: a page asked with a Next-Action header, a urlencoded post, Next's 404 under names like its skipped files", async () => {
    // Next takes only a POST for a server action; a GET with the header renders the page, and a
    // urlencoded POST with it gets Next's HTML 404 (action-handler's not-found).
    expect(await runsOn('/board', { 'next-action': 'abc123' })).toBe(true);
    expect(
      await runsOn('/jobs/j1/wheels/w1/run', {
        'next-action': 'abc123',
        'content-type': 'application/x-www-form-urlencoded',
      }),
    ).toBe(true);
    expect(await runsOn('/runner-sw-x')).toBe(true);
    expect(await runsOn('/runner-sw/other.js')).toBe(true);
    expect(await runsOn('/favicon.icon')).toBe(true);
    expect(await runsOn('/faviconXico')).toBe(true);
    expect(await runsOn('/icon.svg.html')).toBe(true);
    expect(await runsOn('/_next/imagery')).toBe(true);
    expect(await runsOn('/apiary')).toBe(true);
  });

  it('not the JSON API (an unknown /api/ address answers JSON too), prefetches or build files', async () => {
    expect(await runsOn('/api/wheels/w1/events')).toBe(false);
    expect(await runsOn('/api/nope')).toBe(false);
    expect(await runsOn('/board', { 'next-router-prefetch': '1' })).toBe(false);
    expect(await runsOn('/board', { purpose: 'prefetch' })).toBe(false);
    expect(await runsOn('/_next/static/chunks/app.js')).toBe(false);
    expect(await runsOn('/_next/image')).toBe(false);
    expect(await runsOn('/favicon.ico')).toBe(false);
    expect(await runsOn('/icon.svg')).toBe(false);
    expect(await runsOn('/runner-sw/sw.js')).toBe(false);
    expect(await runsOn('/runner-sw.js')).toBe(false);
  });
});
