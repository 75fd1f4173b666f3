/**
 * What the runner's service worker answers, as pure functions (unit-tested): a navigation to a
 * runner page (network first, the last good copy offline) and nothing else of the app's own. API
 * calls, server-action POSTs, customer links (`/r/`), photos and every other page go straight to
 * the network, uncached: they belong to one person or change on every visit.
 */
import { RUNNER_CACHE_PREFIX } from './cache-names';

/** `/jobs/<jobId>/wheels/<wheelId>/run`, with or without a trailing slash. */
const RUNNER_PAGE = /^\/jobs\/[^/]+\/wheels\/[^/]+\/run\/?$/;

export function isRunnerPagePath(pathname: string): boolean {
  return RUNNER_PAGE.test(pathname);
}

type RequestLike = { method: string; mode: string; url: string };

/**
 * A browser navigation (a typed address, a reload, a link followed without the app's router) to
 * a runner page of this origin. The app's own client-side moves (RSC fetches) are not navigations;
 * the runner asks for its page to be kept when it mounts instead (`cacheRunnerPageMessage`).
 */
export function isRunnerNavigation(request: RequestLike, origin: string): boolean {
  if (request.method !== 'GET' || request.mode !== 'navigate') return false;
  const url = new URL(request.url);
  return url.origin === origin && isRunnerPagePath(url.pathname);
}

/** The message the runner page sends so its own address is kept even on the very first visit. */
export type CacheRunnerPageMessage = { type: 'cache-runner-page'; page: string };

export function cacheRunnerPageMessage(page: string): CacheRunnerPageMessage {
  return { type: 'cache-runner-page', page };
}

/** Asks the worker when it was built; it answers on the message's port. */
export const BUILD_QUERY = { type: 'runner-sw-build' } as const;

export function isBuildQuery(data: unknown): boolean {
  return (
    typeof data === 'object' && data !== null && 'type' in data && data.type === BUILD_QUERY.type
  );
}

/** The runner page a message asks to keep, or null when it is anything else. */
export function runnerPageFromMessage(data: unknown): string | null {
  if (typeof data !== 'object' || data === null) return null;
  const { type, page } = data as Record<string, unknown>;
  if (type !== 'cache-runner-page' || typeof page !== 'string' || !page.startsWith('/'))
    return null;
  // Judged as the browser will read it (`..`, `?`, `#`, `//` resolved), and kept in that form.
  let url: URL;
  try {
    url = new URL(page, 'https://runner.invalid');
  } catch {
    return null;
  }
  if (url.origin !== 'https://runner.invalid' || url.search || url.hash) return null;
  return isRunnerPagePath(url.pathname) ? url.pathname : null;
}

/**
 * A copy is kept only of a complete, successful page: not an error page, and not the sign-in page
 * a signed-out request was redirected to (it would stand in for the runner under its address).
 */
export function isKeepablePage(response: { ok: boolean; redirected: boolean; type: string }) {
  return response.ok && !response.redirected && response.type === 'basic';
}

/** One copy per runner page, whatever its query string. */
export function pageCopyKey(url: string): string {
  const { origin, pathname } = new URL(url);
  return `${origin}${pathname}`;
}

/**
 * Caches to delete when a new service worker takes over: every cache of ours it does not use
 * (earlier designs' asset and page caches; Serwist removes old precaches itself), never another
 * library's cache on the same origin.
 */
export function outdatedCaches(names: readonly string[], inUse: readonly string[]): string[] {
  return names.filter((name) => name.startsWith(RUNNER_CACHE_PREFIX) && !inUse.includes(name));
}
