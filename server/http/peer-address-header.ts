/** Set by instrumentation.ts from the socket on every request; a client's own value is overwritten. */
// No `server-only` here: instrumentation.ts imports it, and it holds nothing secret.
export const PEER_ADDRESS_HEADER = 'x-ringpass-peer-address';
