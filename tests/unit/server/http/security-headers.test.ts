import { describe, expect, it } from 'vitest';
import { contentSecurityPolicy, newNonce, uploadOrigins } from '@/server/http/security-headers';

const directives = (csp: string) =>
  Object.fromEntries(csp.split('; ').map((d) => [d.split(' ')[0], d.split(' ').slice(1)]));

describe('Content-Security-Policy', () => {
  const fake = uploadOrigins({
    UPLOADTHING_INGEST_URL: 'http://127.0.0.1:2531',
    UPLOADTHING_UFS_HOST: 'localhost:2531',
  });

  it('runs only scripts carrying this response’s nonce, and may not be framed', () => {
    const csp = directives(
      contentSecurityPolicy({ nonce: 'abc123', dev: false, https: false, uploads: fake }),
    );
    expect(csp['script-src']).toEqual(["'self'", "'nonce-abc123'", "'strict-dynamic'"]);
    expect(csp['frame-ancestors']).toEqual(["'none'"]);
    expect(csp['object-src']).toEqual(["'none'"]);
    expect(csp['base-uri']).toEqual(["'self'"]);
    expect(csp['upgrade-insecure-requests']).toBeUndefined(); // plain http on 127.0.0.1 must keep working
  });

  it('lets photos go to the local upload fake and come back from it; the service worker is our own', () => {
    const csp = directives(
      contentSecurityPolicy({ nonce: 'n', dev: false, https: false, uploads: fake }),
    );
    expect(csp['connect-src']).toEqual(["'self'", 'http://127.0.0.1:2531']);
    expect(csp['img-src']).toEqual(
      expect.arrayContaining(["'self'", 'blob:', 'http://localhost:2531']),
    );
    expect(csp['worker-src']).toEqual(["'self'"]);
  });

  it('without the fake’s variables it allows the hosted upload service’s hosts', () => {
    const hosted = uploadOrigins({});
    expect(hosted.connect).toEqual(['https://*.ingest.uploadthing.com']);
    expect(hosted.img).toContain('https://*.ufs.sh');
  });

  it('eval only in development; upgrade-insecure-requests only over https', () => {
    expect(contentSecurityPolicy({ nonce: 'n', dev: true, https: false, uploads: fake })).toContain(
      "'unsafe-eval'",
    );
    expect(contentSecurityPolicy({ nonce: 'n', dev: false, https: true, uploads: fake })).toContain(
      'upgrade-insecure-requests',
    );
  });

  it('a fresh 128-bit nonce every time', () => {
    const a = newNonce();
    expect(Buffer.from(a, 'base64')).toHaveLength(16);
    expect(newNonce()).not.toBe(a);
  });
});
