import 'server-only';

/**
 * The client's address for throttling. Next's server puts the socket address in
 * x-forwarded-for; behind a proxy the proxy must set it (the first entry is used).
 */
export function clientAddress(headers: Headers): string {
  const forwarded = headers.get('x-forwarded-for')?.split(',')[0]?.trim();
  return forwarded || headers.get('x-real-ip') || 'unknown';
}
