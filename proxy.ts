import { NextResponse, type NextRequest } from 'next/server';
import { env } from '@/server/env.mjs';
import {
  contentSecurityPolicy,
  HSTS,
  newNonce,
  uploadOrigins,
} from '@/server/http/security-headers';

/**
 * Security headers that need the request: a fresh CSP nonce per page (Next reads it from the
 * request's Content-Security-Policy header and stamps its scripts with it) and HSTS when the app
 * is served over https. Never an authorisation check; pages and handlers do their own.
 * The fixed headers (nosniff, referrer policy) are in next.config.mjs for every response.
 */
export function proxy(request: NextRequest) {
  const config = env();
  const nonce = newNonce();
  const https = new URL(config.APP_URL).protocol === 'https:';
  const csp = contentSecurityPolicy({
    nonce,
    dev: config.NODE_ENV === 'development',
    https,
    uploads: uploadOrigins(config),
  });

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', csp);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('Content-Security-Policy', csp);
  if (https) response.headers.set('Strict-Transport-Security', HSTS);
  return response;
}

export const config = {
  matcher: [
    {
      // Every HTML answer needs its nonce and HSTS, so only names that never answer HTML are left
      // out, each anchored: a prefix like `runner-sw` also skipped Next's HTML 404 for /runner-sw-x.
      // /api/ answers JSON or bytes only (app/api/[...unknown]/route.ts answers JSON for an unknown
      // path instead of Next's HTML 404). /_next/static/ holds build files, /_next/image images,
      // /runner-sw/sw.js is the runner's worker (a CSP header would apply to the worker itself),
      // /runner-sw.js the retired one; any other /runner-sw/ name is Next's HTML 404, so it runs.
      source:
        '/((?!api/|_next/static/|_next/image$|favicon\\.ico$|icon\\.svg$|runner-sw\\.js$|runner-sw/sw\\.js$).*)',
      // A prefetch renders no HTML, so it needs no nonce (Next's guide leaves them out too). Not a
      // request with a Next-Action header: a GET, or a POST that Next does not take for an action
      // (urlencoded), is answered with an HTML page.
      missing: [
        { type: 'header', key: 'next-router-prefetch' },
        { type: 'header', key: 'purpose', value: 'prefetch' },
      ],
    },
  ],
};
