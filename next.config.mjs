import { assertEnv } from './server/env.mjs';

// Fail fast on a bad configuration, except while linting/type-generating where no server runs.
if (!process.env.RINGPASS_SKIP_ENV_CHECK) assertEnv();

/** @type {import('next').NextConfig} */
const nextConfig = {
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  // Set by the e2e server's build (tests/e2e/serve.ts): `npm test` checks the types once, in its own
  // typecheck step; checking them again in the build cost time and let any type error (a test file
  // still in progress) stop every browser test.
  typescript: { ignoreBuildErrors: process.env.RINGPASS_BUILD_SKIP_TYPECHECK === '1' },
  experimental: {
    // forbidden() and app/forbidden.tsx give a real 403 page to a signed-in user without the role.
    authInterrupts: true,
    // The same cap as the JSON API (server/http/body-limit.ts). Next 16 refuses a larger body
    // before the action runs; a fetch-called action then rejects on the phone (HTTP 500).
    serverActions: { bodySizeLimit: '256kb' },
  },
  // Fixed security headers on every response; the per-request ones (CSP nonce, HSTS) are set in proxy.ts.
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          // For browsers that predate CSP's frame-ancestors.
          { key: 'X-Frame-Options', value: 'DENY' },
        ],
      },
    ];
  },
};

export default nextConfig;
