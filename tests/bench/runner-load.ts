/** bench:runner's load generator: a kept-alive HTTP client, open arrivals, and the server's CPU. */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import http from 'node:http';

/**
 * A light HTTP client with keep-alive for one server: undici's fetch added 2-4 ms of the
 * generator's own CPU to every round trip on this machine, which is not the server's time.
 */
export function httpClient(base: string) {
  // Idle sockets are dropped after 4 s, before Node's server closes them at 5 s
  // (keepAliveTimeout): a request sent on a socket the server is closing fails with ECONNRESET.
  const agent = new http.Agent({ keepAlive: true, maxSockets: 256, timeout: 4000 });
  const post = (
    path: string,
    headers: Record<string, string>,
    body: string,
  ): Promise<{ status: number; text: string }> =>
    new Promise((resolve, reject) => {
      const req = http.request(`${base}${path}`, { method: 'POST', headers, agent }, (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (chunk: string) => (text += chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
      });
      req.on('error', reject);
      req.end(body);
    });
  return { post, close: () => agent.destroy() };
}

/** Open arrivals: requests start on schedule whether or not earlier ones have finished. */
export async function load(rate: number, seconds: number, run: (i: number) => Promise<number>) {
  const times: number[] = [];
  let errors = 0;
  const inflight: Promise<void>[] = [];
  const start = performance.now();
  const total = Math.round(rate * seconds);
  for (let i = 0; i < total; i++) {
    const due = start + (i * 1000) / rate;
    const wait = due - performance.now();
    if (wait > 1) await new Promise((r) => setTimeout(r, wait));
    inflight.push(
      run(i).then(
        (ms) => void times.push(ms),
        (error: unknown) => {
          // The first failure of a phase is printed: a refusal and a dropped socket differ.
          if (!errors++) console.log(`[bench] first error: ${String(error).slice(0, 300)}`);
        },
      ),
    );
  }
  await Promise.all(inflight);
  return { times, errors };
}

/** Pins a process and all its threads to one core (util-linux's taskset). */
export function pin(pid: number, core: number) {
  execFileSync('taskset', ['--all-tasks', '--cpu-list', '--pid', String(core), String(pid)], {
    stdio: 'ignore',
  });
}

/** The process listening on a loopback port (the Next server `next start` runs). */
export function listenerPid(port: number): number {
  const out = execFileSync('ss', ['-Hltnp', `sport = :${port}`], { encoding: 'utf8' });
  const pid = /pid=(\d+)/.exec(out)?.[1];
  if (!pid) throw new Error(`nothing listens on ${port}`);
  return Number(pid);
}

/** CPU time (ms) a process has used so far, user and system (Linux /proc; clock ticks of 10 ms). */
export function cpuMs(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return (Number(fields[11]) + Number(fields[12])) * 10;
}
