/**
 * Where to go after signing in: only a path on this site ("/jobs/…"), never another host, so a
 * crafted sign-in link cannot send someone elsewhere. Anything else answers null.
 */
export function returnPath(raw: unknown): string | null {
  if (typeof raw !== 'string' || raw.length > 300) return null;
  // One leading slash, then no second slash or backslash (both mean "another host" to browsers).
  if (!/^\/(?![/\\])/.test(raw) || /[\\\s]/.test(raw)) return null;
  const url = new URL(raw, 'http://ringpass.invalid');
  if (url.origin !== 'http://ringpass.invalid') return null;
  return `${url.pathname}${url.search}`;
}

/** The sign-in page, coming back to `path` afterwards. */
export const signInThenBackTo = (path: string) => `/sign-in?next=${encodeURIComponent(path)}`;
