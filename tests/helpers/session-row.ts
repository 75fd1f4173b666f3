import { createHash, randomBytes } from 'node:crypto';
import { encodeBase32LowerCaseNoPadding } from '@oslojs/encoding';

/**
 * A session made without signing in (benches): the token goes in the cookie, its SHA-256 (hex) in
 * `sessions.id`, as server/auth/session.ts does.
 */
export function newSessionToken(): { token: string; id: string } {
  const token = encodeBase32LowerCaseNoPadding(randomBytes(20));
  return { token, id: createHash('sha256').update(token).digest('hex') };
}
