// No `server-only` here: instrumentation.ts loads this when the Node server starts, outside
// React's server build. Nothing in it is secret, and nothing in the browser imports it.
import { Server, type IncomingMessage } from 'node:http';

/** Set from the socket on every request; a client's own value is overwritten. */
export const PEER_ADDRESS_HEADER = 'x-ringpass-peer-address';

const PATCHED = Symbol.for('ringpass.peerAddressHeader');

/**
 * Next passes server actions and route handlers the request's headers but not its socket, and it
 * keeps a client-sent X-Forwarded-For as it is, so the socket's address would be lost. This
 * copies it into PEER_ADDRESS_HEADER on every request, before Next sees the request
 * (server/http/request-meta.ts reads it). Safe to call more than once.
 */
export function recordPeerAddresses() {
  const proto = Server.prototype as Server & { [PATCHED]?: true };
  if (proto[PATCHED]) return;
  proto[PATCHED] = true;
  const emit = proto.emit;
  proto.emit = function emitWithPeerAddress(
    this: Server,
    event: string | symbol,
    ...args: unknown[]
  ) {
    if (event === 'request') {
      const request = args[0] as IncomingMessage;
      request.headers[PEER_ADDRESS_HEADER] = request.socket.remoteAddress ?? 'unknown';
    }
    return Reflect.apply(emit, this, [event, ...args]) as boolean;
  } as typeof proto.emit;
}
