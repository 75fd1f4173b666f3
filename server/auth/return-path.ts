import type { Role } from '@/db/schema';

/**
 * Where to go after signing in: only a path on this site ("/jobs/…"), never another host, so a
 * crafted sign-in link cannot send someone elsewhere. Anything else answers null.
 *
 * The check runs on the path as a browser will see it: after dot segments are resolved
 * ("/.//evil.test" becomes "//evil.test", another host) and after percent-decoding (a proxy or
 * framework that decodes "%2F" once more must not find a second slash either).
 */
const BASE = 'http://ringpass.invalid';
const MAX_LENGTH = 300;
// Control characters and whitespace: browsers strip tabs and newlines inside URLs, which can join
// "/\t/evil" into "//evil".
const UNSAFE_CHAR = /[\u0000-\u0020\u007f\\]/;
const DECODE_ROUNDS = 3;

/** A path that every browser resolves on the current host: one slash, then no slash or backslash. */
function isSingleSlashPath(path: string): boolean {
  return path.startsWith('/') && path[1] !== '/' && !UNSAFE_CHAR.test(path);
}

/** Safe as written, and still safe once its dot segments are resolved. */
function safeForm(path: string): boolean {
  if (!isSingleSlashPath(path)) return false;
  try {
    const url = new URL(path, BASE);
    return url.origin === BASE && isSingleSlashPath(url.pathname);
  } catch {
    return false;
  }
}

/**
 * The path and its decoded forms are all safe: anything that decodes "%2F" or "%2e" again before
 * routing must not find another host either. Malformed escapes, or more layers of encoding than
 * a link ever needs, are refused.
 */
function safeWhenDecoded(path: string): boolean {
  let current = path;
  for (let round = 0; round < DECODE_ROUNDS; round++) {
    if (!safeForm(current)) return false;
    let decoded: string;
    try {
      decoded = decodeURIComponent(current);
    } catch {
      return false;
    }
    if (decoded === current) return true;
    current = decoded;
  }
  return false;
}

export function returnPath(raw: unknown): string | null {
  if (typeof raw !== 'string' || raw.length > MAX_LENGTH) return null;
  if (!isSingleSlashPath(raw)) return null;
  let url: URL;
  try {
    url = new URL(raw, BASE);
  } catch {
    return null;
  }
  if (url.origin !== BASE) return null;
  const path = `${url.pathname}${url.search}`;
  if (path.length > MAX_LENGTH || !safeWhenDecoded(url.pathname) || UNSAFE_CHAR.test(url.search))
    return null;
  return path;
}

/** The sign-in page, coming back to `path` afterwards. */
export const signInThenBackTo = (path: string) => `/sign-in?next=${encodeURIComponent(path)}`;

/**
 * Where a member lands after signing in when no page asked for them: a technician's phone
 * starts at their next wheel, an apprentice at practice, a lead at the board.
 */
export const homePathFor = (role: Role) =>
  role === 'technician' ? '/my-wheels' : role === 'apprentice' ? '/practice' : '/board';
