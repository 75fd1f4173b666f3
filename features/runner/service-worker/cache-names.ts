/**
 * The names of the caches the runner's service worker keeps (`sw.ts`), in one place: the sign-in
 * page deletes the page copies by this name, and a new service worker deletes every other
 * `ringpass-runner-` cache it does not recognise.
 */

/** The last good copy of each runner page this phone opened, for an offline reload. */
export const RUNNER_PAGES_CACHE = 'ringpass-runner-pages-v1';

/** The build's files the runner runs on (Serwist's precache; one cache, its entries per build). */
export const RUNNER_PRECACHE = 'ringpass-runner-precache-v1';

/** Every cache this app's service workers ever made starts with this. */
export const RUNNER_CACHE_PREFIX = 'ringpass-runner-';
