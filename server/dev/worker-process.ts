/**
 * Runs the queue's worker as a child process beside a web server (npm start, npm run dev, the e2e
 * server) as `npm run worker` does: compiled first (worker-build.ts, a fraction of a second), then
 * under plain node, with the same environment as the server.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildWorker } from './worker-build';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

export function spawnWorker(env: NodeJS.ProcessEnv): ChildProcess {
  return spawn(process.execPath, [buildWorker()], {
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
