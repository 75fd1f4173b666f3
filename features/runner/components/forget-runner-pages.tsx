'use client';

import { useEffect } from 'react';
import { RUNNER_PAGES_CACHE } from '../service-worker/cache-names';

/**
 * Mounted by the sign-in, sign-up and invite pages (their layout), where signing out, an ended
 * session and a new person all land: the runner pages kept for offline reloads were rendered for
 * the last person, so the next one must not get them.
 * Only the page copies go; the build's files stay precached, and the outbox in IndexedDB stays,
 * kept per person.
 */
export function ForgetRunnerPages() {
  useEffect(() => {
    if (typeof caches === 'undefined') return;
    void caches.delete(RUNNER_PAGES_CACHE).catch(() => {});
  }, []);
  return null;
}
