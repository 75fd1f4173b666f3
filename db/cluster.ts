/**
 * The project's own PostgreSQL: a cluster in .data/pg, listening on 127.0.0.1 only, on a fixed
 * port. Used by `npm start`, `npm run dev` and the tests; never by a deployment (set DATABASE_URL).
 *
 *   tsx db/cluster.ts start | stop | status | ensure-binaries
 *
 * Trust authentication is acceptable only because nothing but loopback can reach the cluster.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import postgres from 'postgres';

export const CLUSTER_PORT = 54329;
const PROJECT_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const SERVICE_USER = 'postgres';
const isRoot = process.getuid?.() === 0;

export function clusterUrl(database: string) {
  return `postgres://postgres@127.0.0.1:${CLUSTER_PORT}/${database}`;
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
  if (result.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed (exit ${result.status})`);
}

/** initdb refuses to run as root, so as root the cluster belongs to the `postgres` user. */
function asServiceUser(cmd: string, args: string[]) {
  return isRoot ? { cmd: 'runuser', args: ['-u', SERVICE_USER, '--', cmd, ...args] } : { cmd, args };
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
  run('useradd', ['--system', '--home-dir', '/var/lib/postgresql', '--shell', '/bin/sh', SERVICE_USER]);
}

/**
 * The data folder: .data/pg in the project. When root runs a checkout that the `postgres` user
 * cannot traverse (a clone under /root, say), the cluster goes to a per-checkout folder in /tmp.
 */
function dataDir(): string {
  const inProject = path.join(PROJECT_ROOT, '.data', 'pg');
  if (!isRoot) return inProject;
  mkdirSync(path.dirname(inProject), { recursive: true });
  const reachable =
    spawnSync('runuser', ['-u', SERVICE_USER, '--', 'test', '-w', path.dirname(inProject)]).status === 0 ||
    spawnSync('runuser', ['-u', SERVICE_USER, '--', 'test', '-x', path.dirname(inProject)]).status === 0;
  if (reachable) return inProject;
  const hash = createHash('sha256').update(PROJECT_ROOT).digest('hex').slice(0, 12);
  return path.join('/tmp', `ringpass-pg-${hash}`);
}

async function isAccepting(): Promise<boolean> {
  const sql = postgres(clusterUrl('postgres'), { max: 1, connect_timeout: 2, onnotice: () => {} });
  try {
    await sql`select 1`;
    return true;
  } catch {
    return false;
  } finally {
    await sql.end({ timeout: 1 }).catch(() => {});
  }
}

function pidIsPostgres(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('postgres');
  } catch {
    return false;
  }
}

async function waitUntilAccepting(seconds: number) {
  for (let i = 0; i < seconds * 4; i++) {
    if (await isAccepting()) return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

/** Starts the cluster if it is not already answering. Safe to call any number of times. */
export async function startCluster(): Promise<void> {
  if (await isAccepting()) return;
  const bin = ensureBinaries();
  ensureServiceUser();
  const dir = dataDir();
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  if (isRoot) execFileSync('chown', ['-R', `${SERVICE_USER}:`, dir]);

  if (!existsSync(path.join(dir, 'PG_VERSION'))) {
    log(`creating a cluster in ${dir}`);
    const init = runAsService(path.join(bin, 'initdb'), [
      '-D', dir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8',
    ], { quiet: true });
    if (init.status !== 0) throw new Error(`initdb failed:\n${init.stderr}`);
  }

  const pidFile = path.join(dir, 'postmaster.pid');
  if (existsSync(pidFile)) {
    const pid = Number(readFileSync(pidFile, 'utf8').split('\n')[0]);
    if (pidIsPostgres(pid)) {
      if (await waitUntilAccepting(15)) return;
      throw new Error(`PostgreSQL (pid ${pid}) owns ${dir} but does not answer on port ${CLUSTER_PORT}.`);
    }
    log('removing a stale postmaster.pid left by a server that is no longer running');
    rmSync(pidFile);
  }

  log(`starting PostgreSQL on 127.0.0.1:${CLUSTER_PORT}`);
  const start = runAsService(path.join(bin, 'pg_ctl'), [
    '-D', dir, '-l', path.join(dir, 'server.log'), '-w', '-t', '60',
    '-o', `-p ${CLUSTER_PORT} -k ${dir} -c listen_addresses=127.0.0.1`,
    'start',
  ], { quiet: true });
  if (start.status !== 0 || !(await waitUntilAccepting(30))) {
    const tail = existsSync(path.join(dir, 'server.log'))
      ? readFileSync(path.join(dir, 'server.log'), 'utf8').split('\n').slice(-15).join('\n')
      : '';
    throw new Error(`PostgreSQL did not start.\n${start.stderr ?? ''}\n${tail}`);
  }
}

export async function stopCluster(): Promise<void> {
  const bin = findBinDir();
  const dir = dataDir();
  if (!bin || !existsSync(path.join(dir, 'postmaster.pid'))) {
    log('not running');
    return;
  }
  runAsService(path.join(bin, 'pg_ctl'), ['-D', dir, '-m', 'fast', '-w', 'stop'], { quiet: true });
  log('stopped');
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
    case 'start':
      await startCluster();
      log(`ready: ${clusterUrl('ringpass')}`);
      return;
    case 'stop':
      return stopCluster();
    case 'status':
      log((await isAccepting()) ? `running on 127.0.0.1:${CLUSTER_PORT}` : 'not running');
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
