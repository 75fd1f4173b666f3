import 'server-only';
import { env } from '@/server/env.mjs';
import { PEER_ADDRESS_HEADER } from '@/server/http/peer-address';

/**
 * The client's address for throttling.
 *
 * What Next 16 hands a server action or route handler is headers only: `next start` sets
 * X-Forwarded-For to the socket's address *only when the request has none*
 * (`req.headers['x-forwarded-for'] ??= socket.remoteAddress` in its base server), so a client
 * that sends its own X-Forwarded-For hides the socket's address completely. `instrumentation.ts`
 * therefore copies the socket's address into PEER_ADDRESS_HEADER on every request, overwriting
 * whatever the client sent there.
 *
 * The chain is X-Forwarded-For's entries followed by that socket address. Each trusted proxy
 * appends the address it saw, so with `hops` proxies the client is `hops` entries left of the
 * socket address; with 0 it is the socket address itself. Entries further left were written by
 * the client and are never used.
 */
export function clientAddress(headers: Headers, hops: number = env().TRUST_PROXY_HOPS): string {
  const forwarded = (headers.get('x-forwarded-for') ?? '')
    .split(',')
    .map((entry) => entry.trim())
    .filter(Boolean);
  const peer = headers.get(PEER_ADDRESS_HEADER)?.trim();
  // Without the socket's address (a server started without instrumentation.ts, or the tests),
  // the rightmost entry is the best there is: Next's own when the client sent none.
  const chain = peer ? [...forwarded, peer] : forwarded;
  if (!chain.length) return 'unknown';
  // Fewer entries than proxies: the request did not pass through all of them; the leftmost
  // entry is the earliest address known.
  return chain[Math.max(0, chain.length - 1 - hops)]!;
}
