import type { IncomingMessage } from 'node:http';
import { PEER_ADDRESS_HEADER } from '@/server/http/peer-address-header';

const PATCHED = Symbol.for('ringpass.peerAddressHeader');

/**
 * Runs once when the Next server starts. Next passes server actions and route handlers the
 * request's headers but not its socket, and it keeps a client-sent X-Forwarded-For as it is, so
 * the socket's address would be lost. Every incoming request gets it in PEER_ADDRESS_HEADER
 * before Next sees the request (server/http/request-meta.ts reads it).
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const http = await import('node:http');
  const proto = http.Server.prototype as typeof http.Server.prototype & { [PATCHED]?: true };
  if (proto[PATCHED]) return;
  proto[PATCHED] = true;
  const emit = proto.emit;
  proto.emit = function emitWithPeerAddress(this: unknown, event: string | symbol, ...args: unknown[]) {
    if (event === 'request') {
      const request = args[0] as IncomingMessage;
      request.headers[PEER_ADDRESS_HEADER] = request.socket.remoteAddress ?? 'unknown';
    }
    return Reflect.apply(emit, this, [event, ...args]) as boolean;
  } as typeof proto.emit;
}
