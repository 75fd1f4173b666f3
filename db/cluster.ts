/**
 * The project's own PostgreSQL: a cluster in .data/pg, listening on 127.0.0.1 only. Used by
 * `npm start`, `npm run dev` and the tests; never by a deployment (set DATABASE_URL).
 *
 *   tsx db/cluster.ts start | stop | status | ensure-binaries
 *
 * Several checkouts may share one machine (a CI clone beside a developer's running app), so a
 * server answering on the port is used only when it is this checkout's own (`SHOW
 * data_directory`); otherwise the next free port is taken and remembered in .data/pg-port.
 * RINGPASS_PG_PORT fixes the port: then a foreign server there stops us with a message instead.
 *
 * Trust authentication is acceptable only because nothing but loopback can reach the cluster.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import {
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  realpathSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import postgres from 'postgres';

export const DEFAULT_CLUSTER_PORT = 54329;
const PROJECT_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const SERVICE_USER = 'postgres';
const PORT_TRIES = 20;
const isRoot = process.getuid?.() === 0;

/** Which checkout's cluster, and whether its port was fixed by the caller (RINGPASS_PG_PORT). */
export type ClusterOptions = { root?: string; port?: number };

function parsePort(value: string, source: string): number {
  const port = Number(value.trim());
  if (!Number.isInteger(port) || port < 1024 || port > 65535) {
    throw new Error(`${source} must be a port number from 1024 to 65535 (got "${value.trim()}").`);
  }
  return port;
}

const portFile = (root: string) => path.join(root, '.data', 'pg-port');

function fixedPort(options: ClusterOptions): number | undefined {
  if (options.port !== undefined) return options.port;
  const fromEnv = options.root === undefined ? process.env.RINGPASS_PG_PORT : undefined;
  return fromEnv ? parsePort(fromEnv, 'RINGPASS_PG_PORT') : undefined;
}

/** The port this checkout's cluster uses: RINGPASS_PG_PORT, else the remembered one, else 54329. */
export function clusterPort(options: ClusterOptions = {}): number {
  const fixed = fixedPort(options);
  if (fixed !== undefined) return fixed;
  const file = portFile(options.root ?? PROJECT_ROOT);
  if (existsSync(file)) return parsePort(readFileSync(file, 'utf8'), file);
  return DEFAULT_CLUSTER_PORT;
}

function rememberPort(root: string, port: number) {
  const file = portFile(root);
  mkdirSync(path.dirname(file), { recursive: true });
  if (!existsSync(file) || readFileSync(file, 'utf8').trim() !== String(port))
    writeFileSync(file, `${port}\n`);
}

export function clusterUrl(database: string, options: ClusterOptions = {}) {
  return `postgres://postgres@127.0.0.1:${clusterPort(options)}/${database}`;
}

function log(message: string) {
  console.log(`[db] ${message}`);
}

function findBinDir(): string | undefined {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return undefined;
  const versions = readdirSync(base)
    .filter((v) => existsSync(path.join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(base, versions[0], 'bin') : undefined;
}

/** Finds the server binaries, installing Debian's `postgresql` package when root. */
export function ensureBinaries(): string {
  const found = findBinDir();
  if (found) return found;
  if (!isRoot) {
    throw new Error(
      'PostgreSQL server binaries were not found under /usr/lib/postgresql/*/bin.\n' +
        'Install them (Debian/Ubuntu: `sudo apt-get install -y postgresql`) or set DATABASE_URL ' +
        'to an existing server.',
    );
  }
  log('PostgreSQL server binaries missing: installing Debian package `postgresql` with apt…');
  run('apt-get', ['update', '-qq']);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'postgresql'], {
    DEBIAN_FRONTEND: 'noninteractive',
  });
  const installed = findBinDir();
  if (!installed) throw new Error('apt installed postgresql but no pg_ctl was found.');
  return installed;
}

function run(cmd: string, args: string[], extraEnv: Record<string, string> = {}) {
  const result = spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, ...extraEnv } });
  if (result.status !== 0)
    throw new Error(`${cmd} ${args.join(' ')} failed (exit ${result.status})`);
}

/** initdb refuses to run as root, so as root the cluster belongs to the `postgres` user. */
function asServiceUser(cmd: string, args: string[]) {
  return isRoot
    ? { cmd: 'runuser', args: ['-u', SERVICE_USER, '--', cmd, ...args] }
    : { cmd, args };
}

function runAsService(cmd: string, args: string[], options: { quiet?: boolean } = {}) {
  const wrapped = asServiceUser(cmd, args);
  return spawnSync(wrapped.cmd, wrapped.args, {
    encoding: 'utf8',
    stdio: options.quiet ? 'pipe' : ['ignore', 'inherit', 'inherit'],
    cwd: '/',
  });
}

function ensureServiceUser() {
  if (!isRoot) return;
  if (spawnSync('id', ['-u', SERVICE_USER]).status === 0) return;
  log(`creating system user ${SERVICE_USER}`);
  run('useradd', [
    '--system',
    '--home-dir',
    '/var/lib/postgresql',
    '--shell',
    '/bin/sh',
    SERVICE_USER,
  ]);
}

/**
 * The data folder: .data/pg in the project. When root runs a checkout that the `postgres` user
 * cannot traverse (a clone under /root, say), the cluster goes to a per-checkout folder in /tmp.
 */
export function clusterDataDir(root: string = PROJECT_ROOT): string {
  const inProject = path.join(root, '.data', 'pg');
  if (!isRoot) return inProject;
  mkdirSync(path.dirname(inProject), { recursive: true });
  const reachable =
    spawnSync('runuser', ['-u', SERVICE_USER, '--', 'test', '-w', path.dirname(inProject)])
      .status === 0 ||
    spawnSync('runuser', ['-u', SERVICE_USER, '--', 'test', '-x', path.dirname(inProject)])
      .status === 0;
  if (reachable) return inProject;
  const hash = createHash('sha256').update(root).digest('hex').slice(0, 12);
  return path.join('/tmp', `ringpass-pg-${hash}`);
}

const samePath = (a: string, b: string) => {
  const real = (p: string) => (existsSync(p) ? realpathSync(p) : path.resolve(p));
  return real(a) === real(b);
};

function portIsOpen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    socket.setTimeout(2000);
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('timeout', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

/** Who answers on the port: nobody, this checkout's cluster, or something else (with what it said). */
export async function probePort(
  port: number,
  dir: string,
): Promise<{ kind: 'free' } | { kind: 'ours' } | { kind: 'foreign'; detail: string }> {
  if (!(await portIsOpen(port))) return { kind: 'free' };
  const sql = postgres(`postgres://postgres@127.0.0.1:${port}/postgres`, {
    max: 1,
    connect_timeout: 3,
    onnotice: () => {},
  });
  try {
    const [row] = await sql<{ data_directory: string }[]>`show data_directory`;
    const theirs = row?.data_directory ?? '';
    return samePath(theirs, dir)
      ? { kind: 'ours' }
      : { kind: 'foreign', detail: `a PostgreSQL cluster in ${theirs}` };
  } catch (error) {
    return {
      kind: 'foreign',
      detail: `a server that would not show its data directory (${error instanceof Error ? error.message : String(error)})`,
    };
  } finally {
    await sql.end({ timeout: 1 }).catch(() => {});
  }
}

/** The pid and port in the data folder's postmaster.pid, when that server is still alive. */
function runningServer(dir: string): { pid: number; port: number } | undefined {
  const pidFile = path.join(dir, 'postmaster.pid');
  if (!existsSync(pidFile)) return undefined;
  const lines = readFileSync(pidFile, 'utf8').split('\n');
  const pid = Number(lines[0]);
  const port = Number(lines[3]);
  return pidIsPostgres(pid) ? { pid, port } : undefined;
}

function pidIsPostgres(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('postgres');
  } catch {
    return false;
  }
}

async function waitUntilOurs(port: number, dir: string, seconds: number) {
  for (let i = 0; i < seconds * 4; i++) {
    if ((await probePort(port, dir)).kind === 'ours') return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

/** The first port from `first` on where nobody answers, or where our own cluster already does. */
async function choosePort(
  first: number,
  fixed: boolean,
  dir: string,
): Promise<{ port: number; ours: boolean }> {
  for (let port = first; port < first + PORT_TRIES && port <= 65535; port++) {
    const found = await probePort(port, dir);
    if (found.kind === 'free') return { port, ours: false };
    if (found.kind === 'ours') return { port, ours: true };
    if (fixed) {
      throw new Error(
        `127.0.0.1:${port} is answered by ${found.detail}, not by this checkout's cluster (${dir}).\n` +
          'Set RINGPASS_PG_PORT to a free port, unset it to let the project pick one, or stop that server.',
      );
    }
    log(`127.0.0.1:${port} is taken by ${found.detail}; trying ${port + 1}`);
  }
  throw new Error(
    `No free port for this checkout's cluster from ${first} to ${first + PORT_TRIES - 1}; set RINGPASS_PG_PORT.`,
  );
}

/**
 * Starts this checkout's cluster unless it is already running, on the remembered port or the
 * next free one; never uses a server that another checkout (or anything else) runs. Safe to call
 * any number of times. `started` says whether this call started it (so a test run can stop it).
 */
export async function startCluster(
  options: ClusterOptions = {},
): Promise<{ port: number; started: boolean }> {
  const root = options.root ?? PROJECT_ROOT;
  const fixed = fixedPort(options);
  const dir = clusterDataDir(root);

  const running = runningServer(dir);
  if (running) {
    if (fixed !== undefined && fixed !== running.port) {
      throw new Error(
        `This checkout's cluster already runs on port ${running.port}, not ${fixed} (RINGPASS_PG_PORT): stop it first (npm run db:stop).`,
      );
    }
    if (!(await waitUntilOurs(running.port, dir, 15))) {
      throw new Error(
        `PostgreSQL (pid ${running.pid}) owns ${dir} but does not answer on port ${running.port}.`,
      );
    }
    if (fixed === undefined) rememberPort(root, running.port);
    return { port: running.port, started: false };
  }

  const chosen = await choosePort(clusterPort(options), fixed !== undefined, dir);
  if (fixed === undefined) rememberPort(root, chosen.port);
  // Ours without a live pid file is unlikely (a server started by hand on a copied folder); use it.
  if (chosen.ours) return { port: chosen.port, started: false };
  const port = chosen.port;

  const bin = ensureBinaries();
  ensureServiceUser();
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (isRoot) execFileSync('chown', ['-R', `${SERVICE_USER}:`, dir]);

  if (!existsSync(path.join(dir, 'PG_VERSION'))) {
    log(`creating a cluster in ${dir}`);
    const init = runAsService(
      path.join(bin, 'initdb'),
      ['-D', dir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8'],
      { quiet: true },
    );
    if (init.status !== 0) throw new Error(`initdb failed:\n${init.stderr}`);
  }

  const pidFile = path.join(dir, 'postmaster.pid');
  if (existsSync(pidFile)) {
    log('removing a stale postmaster.pid left by a server that is no longer running');
    rmSync(pidFile);
  }

  log(`starting PostgreSQL on 127.0.0.1:${port}`);
  const start = runAsService(
    path.join(bin, 'pg_ctl'),
    [
      '-D',
      dir,
      '-l',
      path.join(dir, 'server.log'),
      '-w',
      '-t',
      '60',
      '-o',
      `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1`,
      'start',
    ],
    { quiet: true },
  );
  if (start.status !== 0 || !(await waitUntilOurs(port, dir, 30))) {
    const tail = existsSync(path.join(dir, 'server.log'))
      ? readFileSync(path.join(dir, 'server.log'), 'utf8').split('\n').slice(-15).join('\n')
      : '';
    throw new Error(`PostgreSQL did not start.\n${start.stderr ?? ''}\n${tail}`);
  }
  return { port, started: true };
}

/** Stops this checkout's cluster (found by its data folder, whatever port it is on). */
export async function stopCluster(options: ClusterOptions = {}): Promise<void> {
  const bin = findBinDir();
  const dir = clusterDataDir(options.root ?? PROJECT_ROOT);
  if (!bin || !runningServer(dir)) {
    log('not running');
    return;
  }
  runAsService(path.join(bin, 'pg_ctl'), ['-D', dir, '-m', 'fast', '-w', 'stop'], { quiet: true });
  log('stopped');
}

/**
 * Runs `body` with this checkout's cluster up, and afterwards, pass or fail, stops it again if
 * this call started it (a cluster that was already running, say for `npm start`, stays).
 * `onStarted` hands out the stop for a caller that may be interrupted by a signal.
 */
export async function withCluster<T>(
  body: () => Promise<T>,
  options: ClusterOptions & { onStarted?: (stop: () => Promise<void>) => void } = {},
): Promise<T> {
  const { started } = await startCluster(options);
  let stopped = !started;
  const stop = async () => {
    if (stopped) return;
    stopped = true;
    log('stopping the cluster this run started');
    await stopCluster(options);
  };
  if (started) options.onStarted?.(stop);
  try {
    return await body();
  } finally {
    await stop();
  }
}

/** Creates the database when it does not exist yet. */
export async function ensureDatabase(name: string): Promise<void> {
  if (!/^[a-z0-9_]+$/.test(name)) throw new Error(`unsafe database name: ${name}`);
  const sql = postgres(clusterUrl('postgres'), { max: 1, onnotice: () => {} });
  try {
    const rows = await sql`select 1 from pg_database where datname = ${name}`;
    if (rows.length === 0) await sql.unsafe(`create database ${name}`);
  } finally {
    await sql.end({ timeout: 2 });
  }
}

/** Drops (closing its connections) and creates a database: for tests and benchmarks only. */
export async function recreateDatabase(name: string): Promise<void> {
  if (!/^[a-z0-9_]+$/.test(name)) throw new Error(`unsafe database name: ${name}`);
  const sql = postgres(clusterUrl('postgres'), { max: 1, onnotice: () => {} });
  try {
    await sql.unsafe(`drop database if exists ${name} with (force)`);
    await sql.unsafe(`create database ${name}`);
  } finally {
    await sql.end({ timeout: 2 });
  }
}

async function main(command: string | undefined) {
  switch (command) {
    case 'start': {
      const { port } = await startCluster();
      log(`ready: ${clusterUrl('ringpass')} (port ${port})`);
      return;
    }
    case 'stop':
      return stopCluster();
    case 'status':
      const running = runningServer(clusterDataDir());
      log(running ? `running on 127.0.0.1:${running.port} (${clusterDataDir()})` : 'not running');
      return;
    case 'ensure-binaries':
      log(`server binaries: ${ensureBinaries()}`);
      return;
    default:
      console.error('usage: tsx db/cluster.ts start | stop | status | ensure-binaries');
      process.exitCode = 2;
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  main(process.argv[2]).catch((error: unknown) => {
    console.error(`[db] ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  });
}
