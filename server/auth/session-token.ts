import 'server-only';
import { sha256 } from '@oslojs/crypto/sha2';
import { encodeBase32LowerCaseNoPadding, encodeHexLowerCase } from '@oslojs/encoding';
import { env } from '@/server/env.mjs';

// Sessions as the successor guide to Lucia describes them: the cookie carries a random token,
// the database only its SHA-256. A copy of the sessions table cannot be replayed as a cookie.

const TOKEN_BYTES = 20; // 160 bits, the guide's size.
const TOKEN_SHAPE = /^[a-z2-7]{32}$/; // base32 of 20 bytes, lower case, no padding.

export function generateSessionToken(): string {
  const bytes = new Uint8Array(TOKEN_BYTES);
  crypto.getRandomValues(bytes);
  return encodeBase32LowerCaseNoPadding(bytes);
}

/** The session's id in the database; null for a cookie that cannot be one of our tokens. */
export function sessionIdOf(token: string): string | null {
  if (!TOKEN_SHAPE.test(token)) return null;
  return encodeHexLowerCase(sha256(new TextEncoder().encode(token)));
}

export type SessionCookie = {
  name: string;
  value: string;
  attributes: {
    httpOnly: true;
    secure: boolean;
    sameSite: 'lax';
    path: '/';
    maxAge: number;
    expires?: Date;
  };
};

export const SESSION_COOKIE = 'ringpass_session';

const secure = () => env().COOKIE_SECURE ?? env().NODE_ENV === 'production';

/** The cookie lives exactly as long as the session may: until its absolute end, not longer. */
export function sessionCookie(token: string, absoluteExpiresAt: Date): SessionCookie {
  const maxAge = Math.max(0, Math.floor((absoluteExpiresAt.getTime() - Date.now()) / 1000));
  return {
    name: SESSION_COOKIE,
    value: token,
    attributes: {
      httpOnly: true,
      secure: secure(),
      sameSite: 'lax',
      path: '/',
      maxAge,
      expires: absoluteExpiresAt,
    },
  };
}

export function blankCookie(): SessionCookie {
  return {
    name: SESSION_COOKIE,
    value: '',
    attributes: { httpOnly: true, secure: secure(), sameSite: 'lax', path: '/', maxAge: 0 },
  };
}
