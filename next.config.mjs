import { assertEnv } from './server/env.mjs';

// Fail fast on a bad configuration, except while linting/type-generating where no server runs.
if (!process.env.RINGPASS_SKIP_ENV_CHECK) assertEnv();

/** @type {import('next').NextConfig} */
const nextConfig = {
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  experimental: {
    // forbidden() and app/forbidden.tsx give a real 403 page to a signed-in user without the role.
    authInterrupts: true,
  },
};

export default nextConfig;
