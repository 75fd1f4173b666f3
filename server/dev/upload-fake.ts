/**
 * A local stand-in for the hosted upload service, for development and tests. The app keeps the
 * real SDK (route handler, React hooks, UTApi); only the service's URLs point here, by env:
 *   UPLOADTHING_TOKEN, UPLOADTHING_INGEST_URL, UPLOADTHING_API_URL, UPLOADTHING_UFS_HOST,
 *   UPLOADTHING_UFS_APP_ID_LOCATION=path, UPLOADTHING_IS_DEV=false (see uploadFakeEnv).
 * It speaks the part of the protocol the SDK uses: route metadata, HEAD/PUT of a presigned URL
 * (signature checked, no more bytes than the declared size), the signed callback to the app and
 * its result, file serving, deleteFiles. A file uploaded with `x-ut-acl=private` is served only
 * through a URL signed by UTApi.generateSignedURL and not yet expired, as the service does.
 * Files are stored in a folder on disk. Loopback only.
 */
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdirSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { Readable, Transform } from 'node:stream';

export type UploadFake = { port: number; env: Record<string, string>; close: () => Promise<void> };

type Pending = { metadata: unknown; callbackUrl: string; callbackSlug: string };

const sign = (payload: string, key: string) =>
  `hmac-sha256=${createHmac('sha256', key).update(payload).digest('hex')}`;

/** Room for the multipart envelope around the file (boundary, part headers). */
const MULTIPART_OVERHEAD = 64 * 1024;

/** Whether `raw` carries a valid `&signature=` over everything before it, made with `key`. */
function signedBy(raw: string, key: string): boolean {
  const at = raw.indexOf('&signature=');
  if (at < 0) return false;
  const given = decodeURIComponent(raw.slice(at + '&signature='.length));
  const expected = sign(raw.slice(0, at), key);
  return (
    given.length === expected.length && timingSafeEqual(Buffer.from(given), Buffer.from(expected))
  );
}

/** Passes a request body through, failing it once more than `limit` bytes have arrived. */
function capped(limit: number) {
  let seen = 0;
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      seen += chunk.length;
      done(seen > limit ? new Error('more bytes than the declared size') : null, chunk);
    },
  });
}

export function uploadFakeEnv(port: number, apiKey: string, appId: string): Record<string, string> {
  const token = Buffer.from(JSON.stringify({ apiKey, appId, regions: ['local'] })).toString(
    'base64',
  );
  return {
    UPLOADTHING_TOKEN: token,
    UPLOADTHING_INGEST_URL: `http://127.0.0.1:${port}`,
    UPLOADTHING_API_URL: `http://127.0.0.1:${port}`,
    // The SDK builds file URLs from this host and allows plain http only for hosts with "local".
    UPLOADTHING_UFS_HOST: `localhost:${port}`,
    UPLOADTHING_UFS_APP_ID_LOCATION: 'path',
    UPLOADTHING_IS_DEV: 'false',
  };
}

/** `port` 0 takes a free port (the returned `port` and `env` name it). */
export async function startUploadFake(options: { port: number; dir: string }): Promise<UploadFake> {
  mkdirSync(options.dir, { recursive: true });
  const apiKey = `sk_local_${randomBytes(16).toString('hex')}`;
  const appId = 'ringpass-local';
  let port = options.port;
  const base = () => `http://127.0.0.1:${port}`;
  const pending = new Map<string, Pending>();
  const results = new Map<string, (data: unknown) => void>();

  const cors = (req: IncomingMessage, res: ServerResponse) => {
    res.setHeader('access-control-allow-origin', req.headers.origin ?? '*');
    res.setHeader('access-control-allow-methods', 'GET, HEAD, PUT, POST, OPTIONS');
    res.setHeader(
      'access-control-allow-headers',
      'range, content-type, x-uploadthing-version, x-uploadthing-package, b3, traceparent, tracestate',
    );
    res.setHeader('access-control-expose-headers', 'x-ut-range-start');
  };
  const json = (res: ServerResponse, status: number, body: unknown) => {
    res.writeHead(status, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  };
  const body = async (req: IncomingMessage) => {
    const chunks: Buffer[] = [];
    for await (const c of req) chunks.push(c as Buffer);
    return Buffer.concat(chunks).toString('utf8');
  };
  const authorised = (req: IncomingMessage) => req.headers['x-uploadthing-api-key'] === apiKey;
  const fileUrl = (key: string) => `http://localhost:${port}/a/${appId}/${key}`;

  async function handlePut(req: IncomingMessage, res: ServerResponse, key: string, url: URL) {
    // The SDK signs the URL up to "&signature"; values are encoded twice.
    const raw = `${base()}${req.url!}`;
    if (!signedBy(raw, apiKey)) return json(res, 403, { error: 'Invalid signature' });
    if (Number(url.searchParams.get('expires')) < Date.now())
      return json(res, 403, { error: 'URL expired' });
    const meta = pending.get(key);
    if (!meta) return json(res, 404, { error: 'Unknown upload' });
    const q = (k: string) => decodeURIComponent(url.searchParams.get(k) ?? '');
    // The presigned URL carries the size the app agreed to; a body beyond it is refused unread.
    const declared = Number(q('x-ut-file-size'));
    if (!Number.isSafeInteger(declared) || declared < 0)
      return json(res, 400, { error: 'No declared file size' });
    if (Number(req.headers['content-length'] ?? 0) > declared + MULTIPART_OVERHEAD)
      return json(res, 413, { error: 'More bytes than the declared size' });
    const upload = Readable.toWeb(
      req.pipe(capped(declared + MULTIPART_OVERHEAD)),
    ) as ReadableStream;
    const request = new Request(raw, {
      method: 'PUT',
      headers: req.headers as HeadersInit,
      body: upload,
      duplex: 'half',
    } as RequestInit);
    const form = await request.formData().catch(() => null);
    if (!form) return json(res, 413, { error: 'More bytes than the declared size' });
    const file = form.get('file');
    if (!(file instanceof Blob)) return json(res, 400, { error: 'No file field' });
    if (file.size > declared) return json(res, 413, { error: 'More bytes than the declared size' });
    const bytes = Buffer.from(await file.arrayBuffer());
    const type = q('x-ut-file-type') || file.type || 'application/octet-stream';
    const acl = q('x-ut-acl') === 'private' ? 'private' : 'public-read';
    writeFileSync(path.join(options.dir, key), bytes);
    writeFileSync(
      path.join(options.dir, `${key}.json`),
      JSON.stringify({ type, name: q('x-ut-file-name'), acl }),
    );
    const ufsUrl = fileUrl(key);
    const fileHash = createHmac('md5', 'x').update(bytes).digest('hex');
    const payload = JSON.stringify({
      status: 'uploaded',
      file: {
        name: q('x-ut-file-name'),
        size: bytes.length,
        type,
        customId: q('x-ut-custom-id') || null,
        key,
        url: ufsUrl,
        appUrl: ufsUrl,
        ufsUrl,
        fileHash,
        lastModified: Date.now(),
      },
      origin: base(),
      metadata: meta.metadata,
    });
    const done = new Promise<unknown>((resolve, reject) => {
      results.set(key, resolve);
      setTimeout(() => reject(new Error('the app did not answer the upload callback')), 15_000);
    });
    const callback = new URL(meta.callbackUrl);
    if (!callback.searchParams.has('slug')) callback.searchParams.set('slug', meta.callbackSlug);
    const hook = await fetch(callback, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'uploadthing-hook': 'callback',
        'x-uploadthing-signature': sign(payload, apiKey),
      },
      body: payload,
    }).catch((e: Error) => e);
    if (hook instanceof Error || !hook.ok)
      return json(res, 502, { error: 'Upload callback failed' });
    try {
      const serverData = await done;
      pending.delete(key);
      json(res, 200, { url: ufsUrl, appUrl: ufsUrl, ufsUrl, fileHash, serverData });
    } catch (error) {
      json(res, 504, { error: (error as Error).message });
    }
  }

  const server = createServer((req, res) => {
    cors(req, res);
    const url = new URL(req.url ?? '/', base());
    const route = `${req.method} ${url.pathname}`;
    void (async () => {
      if (req.method === 'OPTIONS') return res.writeHead(204).end();
      if (route === 'POST /route-metadata') {
        if (!authorised(req)) return json(res, 401, { error: 'Bad api key' });
        const input = JSON.parse(await body(req)) as {
          fileKeys: string[];
          metadata: unknown;
          callbackUrl: string;
          callbackSlug: string;
        };
        for (const key of input.fileKeys)
          pending.set(key, {
            metadata: input.metadata,
            callbackUrl: input.callbackUrl,
            callbackSlug: input.callbackSlug,
          });
        return json(res, 200, { ok: true });
      }
      if (route === 'POST /callback-result') {
        if (!authorised(req)) return json(res, 401, { error: 'Bad api key' });
        const input = JSON.parse(await body(req)) as { fileKey: string; callbackData: unknown };
        results.get(input.fileKey)?.(input.callbackData);
        results.delete(input.fileKey);
        return json(res, 200, { ok: true });
      }
      if (route === 'POST /v6/deleteFiles') {
        if (!authorised(req)) return json(res, 401, { error: 'Bad api key' });
        const input = JSON.parse(await body(req)) as { fileKeys?: string[] };
        let deletedCount = 0;
        for (const key of input.fileKeys ?? []) {
          if (!/^[\w-]+$/.test(key) || !existsSync(path.join(options.dir, key))) continue;
          rmSync(path.join(options.dir, key));
          rmSync(path.join(options.dir, `${key}.json`), { force: true });
          deletedCount++;
        }
        return json(res, 200, { success: true, deletedCount });
      }
      const fileMatch = /^\/a\/[^/]+\/([\w-]+)$/.exec(url.pathname);
      if (req.method === 'GET' && fileMatch) {
        const file = path.join(options.dir, fileMatch[1]!);
        if (!existsSync(file)) return json(res, 404, { error: 'Not found' });
        const { type, acl } = JSON.parse(readFileSync(`${file}.json`, 'utf8')) as {
          type: string;
          acl?: string;
        };
        // A private file needs UTApi's signed URL (signed over the URL as the SDK built it, host included).
        if (acl === 'private') {
          if (!signedBy(`http://${req.headers.host ?? ''}${req.url!}`, apiKey))
            return json(res, 403, { error: 'This file is private: a signed URL is required' });
          if (!(Number(url.searchParams.get('expires')) >= Date.now()))
            return json(res, 403, { error: 'URL expired' });
        }
        res.writeHead(200, { 'content-type': type, 'cache-control': 'private, max-age=300' });
        return res.end(readFileSync(file));
      }
      const keyMatch = /^\/([\w-]+)$/.exec(url.pathname);
      if (keyMatch && req.method === 'HEAD') {
        res.writeHead(200, { 'x-ut-range-start': '0' });
        return res.end();
      }
      if (keyMatch && req.method === 'PUT') return handlePut(req, res, keyMatch[1]!, url);
      json(res, 404, { error: `No route for ${route}` });
    })().catch((error: Error) => {
      if (!res.headersSent) json(res, 500, { error: error.message });
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  port = (server.address() as AddressInfo).port;
  return {
    port,
    env: uploadFakeEnv(port, apiKey, appId),
    close: () => new Promise((r) => server.close(() => r())),
  };
}
