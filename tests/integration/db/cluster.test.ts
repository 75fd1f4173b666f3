import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import postgres from 'postgres';
import { afterAll, describe, expect, it } from 'vitest';
import {
  clusterDataDir,
  clusterPort,
  clusterUrl,
  startCluster,
  stopCluster,
  withCluster,
} from '@/db/cluster';

// Two throwaway "checkouts" in /tmp, each with a cluster of its own: A plays the other checkout
// whose server already answers on the port that B remembers. The project's own cluster is never
// touched (every call names its root).
const base = mkdtempSync(path.join(os.tmpdir(), 'ringpass-cluster-test-'));
chmodSync(base, 0o755); // the postgres user must reach the data folders
const checkoutA = path.join(base, 'a');
const checkoutB = path.join(base, 'b');
for (const dir of [checkoutA, checkoutB]) mkdirSync(dir, { mode: 0o755 });

function canListen(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const server = net.createServer();
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

/**
 * A port whose neighbour is free too (checkout B moves on to the next one), below the kernel's
 * ephemeral range: a port from that range can be taken at any moment by another test's outgoing
 * connection or `listen(0)`, between this check and PostgreSQL binding it.
 */
async function freePort(): Promise<number> {
  for (;;) {
    const port = 20_000 + Math.floor(Math.random() * 12_000);
    if ((await canListen(port)) && (await canListen(port + 1))) return port;
  }
}

async function dataDirectoryAt(url: string) {
  const sql = postgres(url, { max: 1, onnotice: () => {} });
  try {
    const [row] = await sql<{ data_directory: string }[]>`show data_directory`;
    return row!.data_directory;
  } finally {
    await sql.end({ timeout: 1 });
  }
}

afterAll(async () => {
  await stopCluster({ root: checkoutA });
  await stopCluster({ root: checkoutB });
  rmSync(base, { recursive: true, force: true });
}, 60_000);

describe('startCluster on a machine with another checkout’s cluster', () => {
  let port = 0;

  it('does not use a server that is not its own: takes the next free port and remembers it', async () => {
    port = await freePort();
    const foreign = await startCluster({ root: checkoutA, port });
    expect(foreign).toEqual({ port, started: true });

    // Checkout B remembers that very port (as if A had taken it over since).
    mkdirSync(path.join(checkoutB, '.data'), { recursive: true });
    writeFileSync(path.join(checkoutB, '.data', 'pg-port'), `${port}\n`);
    const own = await startCluster({ root: checkoutB });

    expect(own.started).toBe(true);
    expect(own.port).not.toBe(port);
    expect(clusterPort({ root: checkoutB })).toBe(own.port);
    expect(readFileSync(path.join(checkoutB, '.data', 'pg-port'), 'utf8').trim()).toBe(
      String(own.port),
    );
    // B's URL reaches B's own folder; A's data is left alone.
    expect(await dataDirectoryAt(clusterUrl('postgres', { root: checkoutB }))).toBe(
      clusterDataDir(checkoutB),
    );
    expect(await dataDirectoryAt(`postgres://postgres@127.0.0.1:${port}/postgres`)).toBe(
      clusterDataDir(checkoutA),
    );

    // Called again, it finds its own running cluster and starts nothing.
    expect(await startCluster({ root: checkoutB })).toEqual({ port: own.port, started: false });
  }, 90_000);

  it('stops with a clear message when the port was fixed and another server answers there', async () => {
    const { port: ownPort } = await startCluster({ root: checkoutB });
    await stopCluster({ root: checkoutB });
    await expect(startCluster({ root: checkoutB, port })).rejects.toThrow(
      /is answered by a PostgreSQL cluster in .*\/a\/\.data\/pg, not by this checkout's cluster/,
    );
    expect(clusterPort({ root: checkoutB })).toBe(ownPort); // the remembered port is unchanged
  }, 60_000);

  it('a run that started the cluster stops it at the end, pass or fail; one already running stays', async () => {
    await stopCluster({ root: checkoutB });
    const answering = () => clusterPort({ root: checkoutB });
    await expect(
      withCluster(
        async () => {
          expect(await dataDirectoryAt(clusterUrl('postgres', { root: checkoutB }))).toBe(
            clusterDataDir(checkoutB),
          );
          throw new Error('a failing test run');
        },
        { root: checkoutB },
      ),
    ).rejects.toThrow('a failing test run');
    await expect(dataDirectoryAt(clusterUrl('postgres', { root: checkoutB }))).rejects.toThrow();

    await startCluster({ root: checkoutB });
    expect(await withCluster(() => Promise.resolve('passed'), { root: checkoutB })).toBe('passed');
    expect(await dataDirectoryAt(`postgres://postgres@127.0.0.1:${answering()}/postgres`)).toBe(
      clusterDataDir(checkoutB),
    );
  }, 60_000);
});
