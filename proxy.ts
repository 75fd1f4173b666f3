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
      // Pages only: not the JSON API, build assets, images or the service worker script.
      source: '/((?!api/|_next/static|_next/image|favicon.ico|icon.svg|runner-sw).*)',
      // A prefetch renders no HTML, so it needs no nonce (Next's guide leaves them out too); nor
      // does a server action called from a page (its Next-Action header): it answers React's
      // payload, never HTML, and the page that calls it came with its own nonce and HSTS. A form
      // posted without JavaScript sends no such header and gets an HTML page, so it keeps both.
      missing: [
        { type: 'header', key: 'next-router-prefetch' },
        { type: 'header', key: 'purpose', value: 'prefetch' },
        { type: 'header', key: 'next-action' },
      ],
    },
  ],
};
