/**
 * Runs `npm run worker`'s entry as a child process beside a web server (npm start, the e2e
 * server): the same tsx flags as the npm script (package.json), the same environment as the server.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const TSX = path.join(ROOT, 'node_modules', '.bin', 'tsx');

export function spawnWorker(env: NodeJS.ProcessEnv): ChildProcess {
  const args = [
    '--import',
    './app/_worker/server-only-hook.mjs',
    path.join('app', '_worker', 'run.ts'),
  ];
  return spawn(TSX, args, {
    cwd: ROOT,
    env,
    stdio: 'inherit',
  });
}

/** Asks the worker to finish the job in hand and waits for it to exit (at most `ms`). */
export function stopWorker(child: ChildProcess, ms = 20_000): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      resolve();
    }, ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill('SIGTERM');
  });
}
