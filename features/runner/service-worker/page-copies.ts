/**
 * Whether a kept runner page still works offline under the service worker now in charge. A page
 * copy names the build's scripts, styles and fonts (`/_next/static/…`); after a deploy the new
 * precache holds only the new build's files, so a copy rendered by the old build would load as a
 * page that never starts. Such copies are dropped: offline, no copy is plainer than a dead one.
 */

/**
 * The build's scripts and styles a page names (`/_next/static/….js|.css`), in its tags and in the
 * inline RSC payload alike; fonts and images are left out: a page runs without them.
 */
export function buildCodeIn(html: string): string[] {
  const found = html.match(/\/_next\/static\/[^"'\s\\)<>?#]+\.(?:js|css)(?=[?#"'\s\\)<>])/g);
  return [...new Set(found ?? [])];
}

/** True when every script and style the copy names is in `precached` (pathnames). */
export function pageCopyStillWorks(html: string, precached: ReadonlySet<string>): boolean {
  const code = buildCodeIn(html);
  return code.length > 0 && code.every((path) => precached.has(path));
}
