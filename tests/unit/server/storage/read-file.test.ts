import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { gzipSync } from 'node:zlib';
import { afterEach, describe, expect, it } from 'vitest';
import { openStoredFile, readStoredFile } from '@/server/storage/read-file';
import type { StoreConfig } from '@/server/storage/store-config';

const FILE = Buffer.alloc(64 * 1024, 7);
let store: ReturnType<typeof createServer> | undefined;

/** A store on loopback answering every request with `answer`; the config that signs its URLs. */
async function storeThat(answer: (req: IncomingMessage, res: ServerResponse) => void) {
  store = createServer(answer).listen(0, '127.0.0.1');
  await new Promise((r) => store!.once('listening', r));
  const { port } = store.address() as AddressInfo;
  const config: StoreConfig = {
    apiKey: 'sk_test_read',
    appId: 'app',
    ufsHost: `localhost:${port}`,
    appIdLocation: 'path',
  };
  return config;
}
/** Resolves when the store's side of the response is closed (finished or cut off). */
const closed = (res: ServerResponse) => new Promise<void>((r) => res.once('close', () => r()));

afterEach(async () => {
  store?.closeAllConnections();
  await new Promise((r) => store?.close(r));
  store = undefined;
});

async function drain(body: ReadableStream<Uint8Array>) {
  const reader = body.getReader();
  const parts: Uint8Array[] = [];
  for (let r = await reader.read(); !r.done; r = await reader.read()) parts.push(r.value);
  return Buffer.concat(parts);
}

describe('a private file streamed from the store', () => {
  it('passes the bytes on with their numeric length, through a URL signed for a minute', async () => {
    let asked = '';
    const config = await storeThat((req, res) => {
      asked = req.url!;
      res.writeHead(200, { 'content-length': FILE.length }).end(FILE);
    });
    const file = await openStoredFile(config, 'key-1');
    expect(file?.length).toBe(FILE.length);
    expect((await drain(file!.body)).equals(FILE)).toBe(true);
    expect(asked).toMatch(/^\/a\/app\/key-1\?expires=\d+&signature=hmac-sha256%3D[0-9a-f]{64}$/);
  });

  it('passes on no length when the store compressed the file (the decoded bytes are longer)', async () => {
    const gzipped = gzipSync(FILE);
    const config = await storeThat((_req, res) => {
      res
        .writeHead(200, { 'content-encoding': 'gzip', 'content-length': gzipped.length })
        .end(gzipped);
    });
    const file = await openStoredFile(config, 'key-gz');
    expect(file?.length).toBeNull();
    expect((await drain(file!.body)).equals(FILE)).toBe(true);
  });

  it('is null when the store never answers, after the answer timeout', async () => {
    const config = await storeThat(() => {});
    const started = performance.now();
    expect(await openStoredFile(config, 'key', { answerMs: 300 })).toBeNull();
    expect(performance.now() - started).toBeLessThan(2_000);
  });

  it('is null for a missing file, and the answer is not left holding its connection', async () => {
    let answered: Promise<void> | undefined;
    const config = await storeThat((_req, res) => {
      answered = closed(res);
      // A body that never ends: only a cancelled read lets the connection go.
      res.writeHead(404, { 'content-type': 'text/plain' }).write('no such file');
    });
    expect(await openStoredFile(config, 'key')).toBeNull();
    await expect(
      Promise.race([
        answered,
        new Promise((_, no) => setTimeout(() => no(new Error('held')), 2_000)),
      ]),
    ).resolves.toBeUndefined();
  });

  it('fails, and lets the store go, when the store stalls halfway', async () => {
    let cut: Promise<void> | undefined;
    const config = await storeThat((_req, res) => {
      cut = closed(res);
      res
        .writeHead(200, { 'content-length': FILE.length })
        .write(FILE.subarray(0, FILE.length / 2));
    });
    const file = await openStoredFile(config, 'key', { idleMs: 300 });
    await expect(drain(file!.body)).rejects.toThrow(/sent nothing for 300 ms/);
    await expect(cut).resolves.toBeUndefined();
  });

  it('stops reading the store when the request it serves goes away', async () => {
    let cut: Promise<void> | undefined;
    const config = await storeThat((_req, res) => {
      cut = closed(res);
      res.writeHead(200).write(FILE.subarray(0, 1024));
    });
    const request = new AbortController();
    const file = await openStoredFile(config, 'key', { signal: request.signal });
    const reader = file!.body.getReader();
    expect((await reader.read()).value?.byteLength).toBeGreaterThan(0);
    request.abort();
    await expect(cut).resolves.toBeUndefined();
    await expect(reader.read()).rejects.toThrow();
  });
});

describe('a private file read whole', () => {
  it('is the bytes, or null for a missing file or a store that does not answer', async () => {
    const config = await storeThat((req, res) => {
      if (req.url!.startsWith('/a/app/here?')) res.writeHead(200).end(FILE);
      else if (req.url!.startsWith('/a/app/gone?')) res.writeHead(404).end();
    });
    expect((await readStoredFile(config, 'here'))?.equals(FILE)).toBe(true);
    expect(await readStoredFile(config, 'gone')).toBeNull();
    expect(await readStoredFile(config, 'silent', { timeoutMs: 300 })).toBeNull();
  });
});
