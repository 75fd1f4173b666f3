/** Shared by the benchmarks: percentiles, and the production build served on loopback. */
import { spawn, spawnSync } from 'node:child_process';
import path from 'node:path';
import { ROOT } from '../helpers/test-services';

export const pct = (xs: number[], p: number) =>
  xs.length
    ? [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))]!
    : NaN;

/**
 * Builds into .next-bench and serves it against `databaseUrl`; resolves once it answers.
 * `serverEnv` is added for the server alone (not the build), e.g. NODE_OPTIONS for a CPU profile.
 */
export async function startProductionServer(
  port: number,
  databaseUrl: string,
  serverEnv: Record<string, string> = {},
) {
  const base = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    NODE_ENV: 'production' as const,
    NEXT_TELEMETRY_DISABLED: '1',
    NEXT_DIST_DIR: '.next-bench',
    DATABASE_URL: databaseUrl,
    APP_URL: base,
    SMTP_URL: 'smtp://127.0.0.1:2599',
    COOKIE_SECURE: 'false',
  };
  const next = path.join(ROOT, 'node_modules', '.bin', 'next');
  // BENCH_REUSE_BUILD=1 serves the last .next-bench as it is (repeat runs of unchanged sources).
  if (process.env.BENCH_REUSE_BUILD === '1') console.log('[bench] reusing .next-bench');
  else {
    console.log('[bench] building the app (next build)…');
    if (spawnSync(next, ['build'], { cwd: ROOT, env, stdio: 'ignore' }).status !== 0)
      throw new Error('next build failed');
  }
  const server = spawn(next, ['start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: ROOT,
    env: { ...env, ...serverEnv },
    stdio: 'ignore',
  });
  for (let i = 0; i < 120; i++) {
    try {
      if ((await fetch(`${base}/sign-in`)).ok) break;
    } catch {}
    await new Promise((r) => setTimeout(r, 500));
  }
  return { base, env, distDir: env.NEXT_DIST_DIR, stop: () => server.kill('SIGTERM') };
}

/** Runs a benchmark's main and exits with its outcome. */
export function run(main: () => Promise<void>) {
  main()
    .then(() => process.exit(0))
    .catch((error: unknown) => {
      console.error(error);
      process.exit(1);
    });
}
