/**
 * `npm test`: every layer, in order, from a bare machine. Installs what is missing (Debian's
 * PostgreSQL server and Chromium, with apt, when run as root), starts the project's database,
 * then: typecheck, lint, formatting (Prettier), unit + component + integration tests (vitest), browser tests (Playwright).
 * Ends with one line "N passed, N failed" over everything that ran. A cluster this run started is
 * stopped at the end, pass or fail (one that was already running, say for `npm start`, stays).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { ensureBinaries, withCluster } from '@/db/cluster';
import { ROOT } from './helpers/test-services';

const CHROMIUM = '/usr/bin/chromium';
const bin = (name: string) => path.join(ROOT, 'node_modules', '.bin', name);

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    throw new Error(
      `Browser tests need Debian's Chromium at ${CHROMIUM}: sudo apt-get install -y chromium`,
    );
  }
  console.log("[test] installing Debian's chromium with apt…");
  for (const args of [
    ['update', '-qq'],
    ['install', '-y', '-qq', '--no-install-recommends', 'chromium'],
  ]) {
    const r = spawnSync('apt-get', args, {
      stdio: 'inherit',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
    if (r.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
}

function step(
  title: string,
  command: string,
  args: string[],
  extraEnv: Record<string, string> = {},
) {
  console.log(`\n[test] ── ${title} ──`);
  const started = Date.now();
  const r = spawnSync(command, args, {
    cwd: ROOT,
    stdio: 'inherit',
    env: { ...process.env, ...extraEnv },
  });
  console.log(
    `[test] ${title}: ${r.status === 0 ? 'ok' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
  return r.status === 0;
}

function readCounts(
  file: string,
  pick: (json: Record<string, unknown>) => [number, number],
): [number, number] {
  try {
    return pick(JSON.parse(readFileSync(path.join(ROOT, file), 'utf8')) as Record<string, unknown>);
  } catch {
    return [0, 0];
  }
}

let stopOurCluster = async () => {};

async function main(): Promise<number> {
  rmSync(path.join(ROOT, '.data', 'reports'), { recursive: true, force: true });
  ensureBinaries();
  ensureChromium();
  return withCluster(runSteps, { onStarted: (stop) => (stopOurCluster = stop) });
}

/** Every layer in order; the exit code (0 when all passed). */
function runSteps(): Promise<number> {
  const noEnv = { RINGPASS_SKIP_ENV_CHECK: '1', NEXT_TELEMETRY_DISABLED: '1' };
  const results = [
    step('typecheck', 'sh', ['-c', `${bin('next')} typegen && ${bin('tsc')} --noEmit`], noEnv),
    step('lint', 'npm', ['run', '--silent', 'lint']),
    step('formatting', bin('prettier'), ['--check', '.', '--log-level=warn']),
    step('unit, component and integration tests', bin('vitest'), [
      'run',
      '--reporter=default',
      '--reporter=json',
      '--outputFile=.data/reports/vitest.json',
    ]),
    step('browser tests', bin('playwright'), ['test'], { NEXT_TELEMETRY_DISABLED: '1' }),
  ];

  const [vPassed, vFailed] = readCounts('.data/reports/vitest.json', (j) => [
    Number(j.numPassedTests),
    Number(j.numFailedTests),
  ]);
  const [ePassed, eFailed] = readCounts('.data/reports/e2e.json', (j) => {
    const s = j.stats as { expected: number; unexpected: number; flaky: number };
    return [s.expected + s.flaky, s.unexpected];
  });
  // A runner that died before writing its report still counts as a failure.
  const vitestFailed = Math.max(vFailed, results[3] ? 0 : 1);
  const browserFailed = Math.max(eFailed, results[4] ? 0 : 1);
  const checksFailed = results.slice(0, 3).filter((ok) => !ok).length;
  const checksPassed = 3 - checksFailed;
  console.log(
    `\n[test] typecheck + lint + format ${checksPassed}/3, vitest ${vPassed}/${vPassed + vFailed}, browser ${ePassed}/${ePassed + eFailed}`,
  );
  console.log(
    `${checksPassed + vPassed + ePassed} passed, ${checksFailed + vitestFailed + browserFailed} failed`,
  );
  return Promise.resolve(results.every(Boolean) ? 0 : 1);
}

// Ctrl+C reaches the children too; once they are gone, stop the cluster and leave.
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.once(signal, () => void stopOurCluster().finally(() => process.exit(130)));
}

void main()
  .catch((error: unknown) => {
    console.error(`[test] ${error instanceof Error ? error.message : String(error)}`);
    return 1;
  })
  .then((code) => process.exit(code));
