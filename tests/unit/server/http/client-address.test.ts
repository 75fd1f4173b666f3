import { request as httpRequest, createServer, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import { describe, expect, it } from 'vitest';
import { register } from '@/instrumentation';
import { PEER_ADDRESS_HEADER } from '@/server/http/peer-address';
import { clientAddress } from '@/server/http/request-meta';

const headers = (forwarded: string | null, peer: string | null) => {
  const h = new Headers();
  if (forwarded !== null) h.set('x-forwarded-for', forwarded);
  if (peer !== null) h.set(PEER_ADDRESS_HEADER, peer);
  return h;
};

describe('clientAddress (the address sign-in throttling counts against)', () => {
  it('with no proxy trusted, is the socket’s address whatever X-Forwarded-For a client sends', () => {
    expect(clientAddress(headers('1.1.1.1', '203.0.113.7'), 0)).toBe('203.0.113.7');
    expect(clientAddress(headers('1.1.1.1, 2.2.2.2', '203.0.113.7'), 0)).toBe('203.0.113.7');
    expect(clientAddress(headers(null, '203.0.113.7'), 0)).toBe('203.0.113.7');
  });

  it('behind N proxies, is the N-th entry from the right: what the outermost trusted proxy saw', () => {
    // client → proxy A (appends the client's address) → proxy B (appends A's) → app (socket = B)
    expect(clientAddress(headers('6.6.6.6, 198.51.100.4, 10.0.0.2', '10.0.0.3'), 2)).toBe(
      '198.51.100.4',
    );
    expect(clientAddress(headers('6.6.6.6, 198.51.100.4', '10.0.0.3'), 1)).toBe('198.51.100.4');
  });

  it('never takes the client-written leftmost entry when the chain is long enough', () => {
    expect(clientAddress(headers('evil-chosen, 198.51.100.4', '10.0.0.3'), 1)).not.toBe(
      'evil-chosen',
    );
  });

  it('without the socket’s header, takes the rightmost entry (Next puts the socket there when a client sent none)', () => {
    expect(clientAddress(headers('203.0.113.9', null), 0)).toBe('203.0.113.9');
    expect(clientAddress(headers('1.1.1.1, 203.0.113.9', null), 0)).toBe('203.0.113.9');
    expect(clientAddress(headers(null, null), 0)).toBe('unknown');
  });
});

describe('instrumentation: the socket’s address reaches the app', () => {
  it('overwrites a client’s own peer header and keeps its X-Forwarded-For for the chain', async () => {
    process.env.NEXT_RUNTIME = 'nodejs';
    await register();
    await register(); // idempotent
    let seen: IncomingHttpHeaders = {};
    const server = createServer((req, res) => {
      seen = req.headers;
      res.end('ok');
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    await new Promise<void>((resolve, reject) => {
      const req = httpRequest(
        {
          host: '127.0.0.1',
          port,
          headers: { 'x-forwarded-for': '6.6.6.6', [PEER_ADDRESS_HEADER]: '6.6.6.6' },
        },
        (res) => {
          res.resume();
          res.on('end', resolve);
        },
      );
      req.on('error', reject);
      req.end();
    });
    server.close();
    expect(seen[PEER_ADDRESS_HEADER]).toBe('127.0.0.1');
    expect(clientAddress(new Headers(seen as Record<string, string>), 0)).toBe('127.0.0.1');
  });
});
