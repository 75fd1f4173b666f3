/** Runs once when the Next server starts (Node only: the socket's address for sign-in throttling). */
export async function register() {
  if (process.env.NEXT_RUNTIME === 'nodejs') {
    const { recordPeerAddresses } = await import('@/server/http/peer-address');
    recordPeerAddresses();
  }
}
